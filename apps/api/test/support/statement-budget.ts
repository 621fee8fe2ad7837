import { AsyncLocalStorage } from 'node:async_hooks';
import type { NextFunction, Request, Response } from 'express';
import type { DataSource, Logger, QueryRunner } from 'typeorm';

/**
 * Most SQL statements one HTTP request may send through TypeORM in the e2e suite (transaction
 * control and the session store's own statements left out). A list or a page that queries per
 * row passes this with a few dozen rows; the suite's lists have more. The background workers
 * (outbox, jobs) run outside any request and are not counted.
 */
export const STATEMENT_BUDGET = 40;

interface RequestCount {
  route: string;
  statements: number;
}

const current = new AsyncLocalStorage<RequestCount>();

/**
 * Counts each request's SQL statements: an Express middleware opens a count per request, and a
 * TypeORM logger (called for every query, in the request's async context) adds to it. Requests
 * over the budget are kept; `assertWithinBudget()` (called when the test app closes) fails the
 * test file naming each.
 */
export class StatementBudget {
  readonly overBudget: RequestCount[] = [];
  /** The most statements seen per route ("GET /api/…" with ids left as they were). */
  readonly maxima = new Map<string, number>();

  constructor(public budget = STATEMENT_BUDGET) {}

  middleware = (req: Request, res: Response, next: NextFunction): void => {
    const count: RequestCount = { route: `${req.method} ${req.path}`, statements: 0 };
    res.on('finish', () => {
      if (count.statements > (this.maxima.get(count.route) ?? 0))
        this.maxima.set(count.route, count.statements);
      if (count.statements > this.budget) this.overBudget.push({ ...count });
    });
    current.run(count, next);
  };

  /** Wraps the data source's logger so that every statement run inside a request is counted. */
  install(dataSource: DataSource): void {
    const inner = dataSource.logger;
    const counting: Logger = {
      logQuery(query: string, parameters?: unknown[], runner?: QueryRunner) {
        const count = current.getStore();
        if (count && !/^(START TRANSACTION|COMMIT|ROLLBACK|SAVEPOINT|RELEASE)/i.test(query))
          count.statements++;
        inner.logQuery(query, parameters, runner);
      },
      logQueryError: (...args) => inner.logQueryError(...args),
      logQuerySlow: (...args) => inner.logQuerySlow(...args),
      logSchemaBuild: (...args) => inner.logSchemaBuild(...args),
      logMigration: (...args) => inner.logMigration(...args),
      log: (...args) => inner.log(...args),
    };
    (dataSource as { logger: Logger }).logger = counting;
  }

  assertWithinBudget(): void {
    if (this.overBudget.length === 0) return;
    const worst = [...this.overBudget].sort((a, b) => b.statements - a.statements).slice(0, 10);
    throw new Error(
      `requests over the budget of ${this.budget} SQL statements (an N+1 query?):\n` +
        worst.map((c) => `  ${c.route}: ${c.statements}`).join('\n'),
    );
  }
}
