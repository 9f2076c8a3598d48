export { useHealthQuery } from './queries';
