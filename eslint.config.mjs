import coreWebVitals from 'eslint-config-next/core-web-vitals';
import typescript from 'eslint-config-next/typescript';

const config = [
  { ignores: ['.next/**', '.next-*/**', 'node_modules/**', 'data/**', 'uploads/**', 'test-results/**', 'playwright-report/**', 'next-env.d.ts', 'drizzle/meta/**'] },
  ...coreWebVitals,
  ...typescript,
];

export default config;
