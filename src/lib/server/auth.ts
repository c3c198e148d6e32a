import { Lucia } from 'lucia';
import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import { COOKIE_SECURE } from 'astro:env/server';
import { db } from './db';
import { sessions, users } from '../../db/schema';
import type { Role } from '../roles';

const adapter = new DrizzlePostgreSQLAdapter(db, sessions, users);

export const lucia = new Lucia(adapter, {
  sessionCookie: {
    name: 'bw_session',
    attributes: {
      // Lucia already sets httpOnly, path '/' and sameSite 'lax'.
      secure: COOKIE_SECURE ?? import.meta.env.PROD,
    },
  },
  getUserAttributes: (attributes) => ({
    name: attributes.name,
    email: attributes.email,
    role: attributes.role,
  }),
});

declare module 'lucia' {
  interface Register {
    Lucia: typeof lucia;
    DatabaseUserAttributes: { name: string; email: string; role: Role };
  }
}
