import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { users } from '../../../db/schema';
import { createPasswordHasher, productionArgon2Cost } from '../../../server/auth/index';
import { browserAgent, createTestApp, testPasswordHasher, type TestApp } from '../../support/test-app';

const password = 'a long enough password';

/** How argon2's PHC string records its cost (the reference implementation's encoding). */
const encodedCost = ({ memoryCost, timeCost, parallelism }: typeof productionArgon2Cost) =>
  `$argon2id$v=19$m=${memoryCost},t=${timeCost},p=${parallelism}$`;

describe('password hashing', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    ctx = await createTestApp({ productionPasswordCost: true });
  });
  afterAll(() => ctx.close());

  it("stores argon2id at OWASP's minimum cost (19 MiB, 2 passes, 1 lane) in an app given no hasher, as npm start builds it", async () => {
    expect(productionArgon2Cost).toEqual({ memoryCost: 19_456, timeCost: 2, parallelism: 1 });
    const agent = browserAgent(ctx.app);
    const res = await agent
      .post('/api/auth/sign-up')
      .send({ email: 'cost@example.com', displayName: 'Cost', password })
      .expect(201);
    const [row] = await ctx.database.db
      .select({ passwordHash: users.passwordHash })
      .from(users)
      .where(eq(users.id, res.body.user.id));
    expect(row?.passwordHash.startsWith(encodedCost(productionArgon2Cost))).toBe(true);
    await browserAgent(ctx.app)
      .post('/api/auth/sign-in')
      .send({ email: 'cost@example.com', password })
      .expect(200);
  });

  it('reads the cost from each hash, so a hash made at another cost still verifies', async () => {
    const production = createPasswordHasher();
    const strong = await production.hash(password);
    const cheap = await testPasswordHasher.hash(password);
    expect(cheap.startsWith(encodedCost({ memoryCost: 8, timeCost: 1, parallelism: 1 }))).toBe(true);
    expect(await testPasswordHasher.verify(strong, password)).toBe(true);
    expect(await production.verify(cheap, password)).toBe(true);
    expect(await production.verify(strong, 'another long password')).toBe(false);
    expect(await production.verify('not a hash', password)).toBe(false);
    expect(await production.verifyAgainstDummy(password)).toBe(false);
  });
});
