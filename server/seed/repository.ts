import { count, eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { appMeta, users } from '../../db/schema';

export function createSeedRepository(db: Database) {
  return {
    async getMeta(key: string): Promise<string | null> {
      const [row] = await db.select().from(appMeta).where(eq(appMeta.key, key));
      return row?.value ?? null;
    },
    async setMeta(key: string, value: string, at: Date) {
      await db
        .insert(appMeta)
        .values({ key, value, updatedAt: at })
        .onConflictDoUpdate({ target: appMeta.key, set: { value, updatedAt: at } });
    },
    async userCount(): Promise<number> {
      const [row] = await db.select({ n: count() }).from(users);
      return row?.n ?? 0;
    },
  };
}
