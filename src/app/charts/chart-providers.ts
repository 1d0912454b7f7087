import { provideCharts, withDefaultRegisterables } from 'ng2-charts';

/** Chart.js with its standard parts, provided by the lazily loaded routes that draw charts (it stays out of the first download). */
export const CHART_PROVIDERS = [provideCharts(withDefaultRegisterables())];
