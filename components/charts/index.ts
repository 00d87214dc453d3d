export { LightOutputChart, type LightOutputChartProps } from './light-output-chart';
export { PowerChart, type PowerChartProps } from './power-chart';
export { SolarChart, type SolarChartProps } from './solar-chart';
export { TimeSeriesChart, type TimeSeriesChartProps } from './time-series-chart';
