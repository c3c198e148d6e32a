import { randomUUID } from 'node:crypto';
import { BASE_URL } from './server';

/** A caller with its own cookie jar and its own client address (sent as X-Forwarded-For). */
export class Client {
  private cookie: string | null = null;
  constructor(readonly address = `10.${rnd()}.${rnd()}.${rnd()}`) {}

  async request(method: string, path: string, body?: unknown, headers: Record<string, string> = {}) {
    // Forms and raw bytes go as they are (fetch sets a multipart type with its boundary); anything else as JSON.
    const raw = body instanceof FormData || body instanceof Uint8Array;
    const res = await fetch(BASE_URL + path, {
      method,
      redirect: 'manual',
      headers: {
        'x-forwarded-for': this.address,
        ...(body !== undefined && !raw ? { 'content-type': 'application/json' } : {}),
        ...(this.cookie ? { cookie: this.cookie } : {}),
        ...headers,
      },
      body: body === undefined ? undefined : raw ? (body as BodyInit) : typeof body === 'string' ? body : JSON.stringify(body),
    });
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const [name, value] = pair!.split('=');
      if (name === 'bw_session') this.cookie = value ? `${name}=${value}` : null;
    }
    const bytes = new Uint8Array(await res.arrayBuffer());
    const text = new TextDecoder().decode(bytes);
    let json: any = null;
    try {
      json = text ? JSON.parse(text) : null;
    } catch {
      json = text;
    }
    return { status: res.status, body: json, bytes, headers: res.headers };
  }

  get = (path: string) => this.request('GET', path);
  post = (path: string, body?: unknown) => this.request('POST', path, body ?? {});
  patch = (path: string, body?: unknown) => this.request('PATCH', path, body ?? {});
  // A browser sends Origin with these; Astro's origin check refuses bodiless and form requests without it.
  delete = (path: string) => this.request('DELETE', path, undefined, { origin: BASE_URL });
  postForm = (path: string, form: FormData) => this.request('POST', path, form, { origin: BASE_URL });

  get hasSession(): boolean {
    return this.cookie !== null;
  }
}

function rnd(): number {
  return Math.floor(Math.random() * 250) + 1;
}

export const DEMO_PASSWORD = 'wren-bench-160';
export const uniqueEmail = (tag: string) => `${tag}-${randomUUID().slice(0, 8)}@test.example`;

/** A freshly signed-up learner, signed in. */
export async function newLearner(tag = 'learner') {
  const client = new Client();
  const email = uniqueEmail(tag);
  const res = await client.post('/api/auth/sign-up', { name: `Test ${tag}`, email, password: 'correct horse battery' });
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { client, email, user: res.body as { id: string; role: string } };
}

/** A demo account, signed in. */
export async function demoUser(email: string) {
  const client = new Client();
  const res = await client.post('/api/auth/sign-in', { email, password: DEMO_PASSWORD });
  if (res.status !== 200) throw new Error(`demo sign-in failed for ${email}: ${res.status}`);
  return { client, user: res.body as { id: string; role: string } };
}
