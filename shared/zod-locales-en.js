// Stands in for zod's locale index in the web bundle (see metro.config.js): English only.
export { default as en } from 'zod/v4/locales/en.js';
