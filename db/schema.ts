import { pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Table definitions only: importable by tooling and tests without loading a database driver.
 * Column names are camelCase here and snake_case in SQL (`casing: 'snake_case'`).
 */

/** Facts about this installation, such as when demo data was seeded. One row per key. */
export const appMeta = pgTable('app_meta', {
  key: text().primaryKey(),
  value: text().notNull(),
  updatedAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
});
