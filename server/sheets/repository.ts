import { eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { teams } from '../../db/schema';

/** The one thing the sheet reads that no other module answers: the team's name for the title block. */
export function createSheetsRepository(db: Database) {
  return {
    async teamName(teamId: string): Promise<string | null> {
      const [row] = await db.select({ name: teams.name }).from(teams).where(eq(teams.id, teamId)).limit(1);
      return row?.name ?? null;
    },
  };
}
export type SheetsRepository = ReturnType<typeof createSheetsRepository>;
