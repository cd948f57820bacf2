/// <reference path="../.astro/types.d.ts" />

declare namespace App {
  interface Locals {
    actor: import('./server/authz').Actor | null;
    sessionId: string | null;
  }
}
