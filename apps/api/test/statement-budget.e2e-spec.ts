import { createTestApp, type TestApp } from './support/app.js';
import { signedIn } from './support/proposal-factories.js';
import { STATEMENT_BUDGET } from './support/statement-budget.js';

/** The suite-wide N+1 guard itself: it counts a request's statements and fails over budget. */
describe('statement budget', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it("counts each request's own SQL statements, not the background workers'", async () => {
    const { agent } = await signedIn(t);
    await agent.get('/api/proposals').expect(200);
    const listed = t.statements.maxima.get('GET /api/proposals');
    expect(listed).toBeGreaterThan(0);
    expect(listed).toBeLessThanOrEqual(STATEMENT_BUDGET);
    // The outbox worker polls every 100 ms meanwhile; waiting adds nothing to any request.
    const before = new Map(t.statements.maxima);
    await new Promise((r) => setTimeout(r, 500));
    expect(t.statements.maxima).toEqual(before);
  });

  it('fails the file naming the route when a request goes over the budget', async () => {
    const { agent } = await signedIn(t);
    t.statements.budget = 0;
    try {
      await agent.get('/api/proposals').expect(200);
      expect(() => t.statements.assertWithinBudget()).toThrow(/GET \/api\/proposals: \d+/);
    } finally {
      t.statements.budget = STATEMENT_BUDGET;
      t.statements.overBudget.length = 0;
    }
    expect(() => t.statements.assertWithinBudget()).not.toThrow();
  });
});
