import request from 'supertest';
import { DEMO_PASSWORD } from '../../server/db/seed/demo-seed';

export const DEMO = {
  admin: 'admin@demo.gaugeline.test',
  engineer: 'engineer@demo.gaugeline.test',
  viewer: 'architect@demo.gaugeline.test',
} as const;
export type DemoRole = keyof typeof DEMO;

export interface Caller {
  agent: ReturnType<typeof request.agent>;
  csrf: string;
  /** Sends a request with the CSRF header; `send` a body for POST/PUT/PATCH. */
  call(method: 'get' | 'post' | 'put' | 'patch' | 'delete', path: string, body?: unknown): Promise<request.Response>;
}

function makeCaller(agent: ReturnType<typeof request.agent>, csrf: string): Caller {
  const caller: Caller = {
    agent,
    csrf,
    async call(method, path, body) {
      const req = agent[method](path).set('X-CSRF-Token', caller.csrf);
      return body === undefined ? req : req.send(body as object);
    },
  };
  return caller;
}

/** A signed-out caller that has fetched its CSRF token. */
export async function anonymous(url: string): Promise<Caller> {
  const agent = request.agent(url);
  const res = await agent.get('/api/session').expect(200);
  return makeCaller(agent, res.body.csrfToken);
}

/** Signs in through the API and returns a caller carrying the session cookie and new token. */
export async function signIn(url: string, email: string, password: string = DEMO_PASSWORD): Promise<Caller> {
  const caller = await anonymous(url);
  const res = await caller.call('post', '/api/session', { email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  caller.csrf = res.body.csrfToken;
  return caller;
}
