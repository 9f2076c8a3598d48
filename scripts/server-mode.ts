/**
 * What backup and restore say when DATABASE_URL is set: they copy the embedded database's
 * directory, and a PostgreSQL server's data is backed up with its own tools.
 */
export const serverModeMessage =
  'DATABASE_URL is set: the data lives on that PostgreSQL server, not in DATA_DIR. Back it up and restore it with pg_dump and pg_restore (README, Operations).';
