import type { NestExpressApplication } from '@nestjs/platform-express';
import type { User } from '../../src/users/entities/user.entity.js';
import type { TestAgent, TestApp } from './app.js';
import { callRoleActor } from './calls-rights.js';
import { makeUser, TEST_PASSWORD } from './factories.js';

/**
 * The rights matrix: for each route, the status every kind of caller gets. Rows live in
 * test/rights-matrix.e2e-spec.ts; a later issue adds its routes there (and, for the call roles,
 * an actor factory below).
 */
export type ActorName =
  'anonymous' | 'unverified' | 'proposer' | 'referee' | 'chair' | 'staff' | 'admin';

/** The five every row must state; referee and chair once their factories exist. */
export type Expected = Record<'anonymous' | 'unverified' | 'proposer' | 'staff' | 'admin', number> &
  Partial<Record<'referee' | 'chair', number>>;

export interface Actor {
  name: ActorName;
  agent: TestAgent;
  /** null for anonymous */
  user: User | null;
}

export interface RightsRequest {
  /** The concrete path (the row's route with its parameters filled); the route's own by default. */
  path?: string;
  body?: object;
}

export interface RightsRow {
  /** Method and path as the route declares them: `PATCH /api/users/:id`. */
  route: string;
  /** Makes what this one request needs (fresh for each actor, so rows never share state). */
  request?: (t: TestApp, actor: Actor) => Promise<RightsRequest> | RightsRequest;
  expect: Expected;
  /** Why a status is what it is, when it is not obvious. */
  note?: string;
}

export type ActorFactory = (t: TestApp, name: ActorName) => Promise<Actor>;

const signedIn =
  (overrides: Partial<User>): ActorFactory =>
  async (t, name) => {
    const user = await makeUser(t.dataSource, overrides);
    const agent = t.agent();
    const res = await agent.signIn(user.email, TEST_PASSWORD);
    if (res.status !== 200) throw new Error(`${name} could not sign in: ${res.status}`);
    return { name, agent, user };
  };

/** How each kind of caller is made. */
export const ACTOR_FACTORIES: Partial<Record<ActorName, ActorFactory>> = {
  anonymous: async (t, name) => ({ name, agent: t.agent(), user: null }),
  unverified: signedIn({ emailVerifiedAt: null }),
  proposer: signedIn({}),
  staff: signedIn({ roles: ['staff'] }),
  admin: signedIn({ roles: ['admin'] }),
  referee: callRoleActor('referee'),
  chair: callRoleActor('chair'),
};

export async function send(actor: Actor, method: string, path: string, body?: object) {
  const agent = actor.agent;
  switch (method) {
    case 'GET':
      return agent.get(path);
    case 'POST':
      return agent.post(path, body);
    case 'PUT':
      return agent.put(path, body);
    case 'PATCH':
      return agent.patch(path, body);
    case 'DELETE':
      return agent.delete(path);
    default:
      throw new Error(`unknown method ${method}`);
  }
}

/** Every route the running app serves, as `METHOD /path` with Express's `:param` names. */
export function servedRoutes(app: NestExpressApplication): string[] {
  const express = app.getHttpAdapter().getInstance() as {
    router: { stack: { route?: { path: string; methods: Record<string, boolean> } }[] };
  };
  return express.router.stack.flatMap((layer) =>
    layer.route
      ? Object.keys(layer.route.methods)
          .filter((m) => m !== '_all')
          .map((m) => `${m.toUpperCase()} ${layer.route!.path}`)
      : [],
  );
}
