export { OverviewUsage } from './components/overview-usage';
export { UsagePage } from './components/usage-page';
export { useCurrentPlan } from './api/usage';
