import { createTemplate, dropTemplate } from './server-databases';

/** The api-postgres project's global setup: one migrated template database for the run. */
export default async function setup() {
  await createTemplate();
  return async () => {
    await dropTemplate();
  };
}
