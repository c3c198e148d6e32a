/// <reference path="../.astro/types.d.ts" />

declare namespace App {
  interface Locals {
    user: import('./lib/roles').SessionUser | null;
    session: import('lucia').Session | null;
  }
}
