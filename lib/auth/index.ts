import NextAuth from 'next-auth';
import { buildAuthConfig } from './config';

// Built lazily so that `next build` never opens the database.
export const { handlers, auth, signIn, signOut } = NextAuth(() => buildAuthConfig());
