import { randomBytes } from 'node:crypto';

// A learner account made for one run through the app's own sign-up and sign-in, so the demo
// learners' data stays untouched and everything the run writes can be removed with the account.

export interface BenchLearner {
  id: string;
  email: string;
  cookie: string;
}

export function benchLearnerEmail(): string {
  return `bench-run-${randomBytes(6).toString('hex')}@larkspur.example`;
}

async function postJson(url: string, body: unknown): Promise<Response> {
  return fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
}

function sessionCookie(response: Response): string {
  const cookie = response.headers.getSetCookie().find((c) => c.startsWith('bw_session='));
  if (!cookie) throw new Error('sign-in answered without a bw_session cookie');
  return cookie.split(';')[0]!;
}

export async function createBenchLearner(origin: string, email: string): Promise<BenchLearner> {
  const password = randomBytes(18).toString('base64url');
  const signUp = await postJson(`${origin}/api/auth/sign-up`, { name: 'Benchmark learner (temporary)', email, password });
  if (signUp.status !== 201) throw new Error(`sign-up answered ${signUp.status}: ${(await signUp.text()).slice(0, 300)}`);
  const signIn = await postJson(`${origin}/api/auth/sign-in`, { email, password });
  if (signIn.status !== 200) throw new Error(`sign-in answered ${signIn.status}: ${(await signIn.text()).slice(0, 300)}`);
  const user = (await signIn.json()) as { id: string; role: string };
  if (user.role !== 'learner') throw new Error(`the benchmark account has role ${user.role}, not learner`);
  return { id: user.id, email, cookie: sessionCookie(signIn) };
}
