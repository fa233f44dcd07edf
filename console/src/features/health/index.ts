export { ApiStatus } from './components/api-status';
export { apiStatusQueryOptions, getApiStatus, healthKeys, useApiStatus } from './api/get-health';
