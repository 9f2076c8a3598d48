export { healthKeys, useHealthQuery } from './queries';
