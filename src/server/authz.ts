/**
 * The one authorization module every page and API route goes through (ASVS 4.0.3 1.4.4).
 * A role grants permissions; installation staff and auditors are further limited to the
 * installations assigned to them, and that scope goes into the query itself
 * (`scopeToInstallations`), never as a check after loading a row.
 */
import { and, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import type { Role } from '../lib/domain';
import { installation } from '../db/schema';
import type { Db, Tx } from '../db/client';
import { errors } from './http';

export const PERMISSIONS = [
  'inventory:read',
  'inventory:write',
  'installations:write',
  'targets:write',
  'bills:read',
  'bills:import',
  'weather:write',
  'baselines:review',
  'shortlist:read',
  'weights:write',
  'flags:write',
  'walkthroughs:read',
  'walkthroughs:plan',
  'walkthroughs:field',
  'measures:approve',
  'kits:read',
  'kits:manage',
  'loans:request',
  'loans:manage',
  'exports',
  'users:manage',
  'outbox:read',
  'activity:read',
  'settings:write',
  'backups',
] as const;
export type Permission = (typeof PERMISSIONS)[number];

const ALL = PERMISSIONS;

/** What each role may do. Source of truth for the role table in README.md. */
export const GRANTS: Record<Role, readonly Permission[]> = {
  admin: ALL,
  regional_manager: [
    'inventory:read',
    'targets:write',
    'bills:read',
    'shortlist:read',
    'weights:write',
    'flags:write',
    'walkthroughs:read',
    'walkthroughs:plan',
    'measures:approve',
    'kits:read',
    'loans:request',
    'exports',
  ],
  installation_staff: [
    'inventory:read',
    'inventory:write',
    'bills:read',
    'bills:import',
    'weather:write',
    'shortlist:read',
    'walkthroughs:read',
    'walkthroughs:plan',
    'walkthroughs:field',
    'kits:read',
    'loans:request',
    'exports',
  ],
  analyst: [
    'inventory:read',
    'bills:read',
    'weather:write',
    'baselines:review',
    'shortlist:read',
    'walkthroughs:read',
    'kits:read',
    'exports',
  ],
  auditor: ['inventory:read', 'bills:read', 'walkthroughs:read', 'walkthroughs:field', 'kits:read', 'loans:request'],
  kit_custodian: ['inventory:read', 'walkthroughs:read', 'kits:read', 'kits:manage', 'loans:manage'],
};

/** Roles whose reach is limited to their assigned installations. */
export const SCOPED_ROLES: readonly Role[] = ['installation_staff', 'auditor'];

export interface Actor {
  id: string;
  email: string;
  name: string;
  role: Role;
  /** Installations this actor may work on when `scoped`; empty otherwise. */
  installationIds: readonly string[];
  scoped: boolean;
}

export function can(actor: Actor | null | undefined, permission: Permission): boolean {
  return !!actor && GRANTS[actor.role].includes(permission);
}

/** The signed-in actor. @throws 401 without a session. */
export function requireActor(locals: App.Locals): Actor {
  if (!locals.actor) throw errors.unauthorized();
  return locals.actor;
}

/** The signed-in actor holding `permission`. @throws 401 or 403. */
export function requirePermission(locals: App.Locals, permission: Permission): Actor {
  const actor = requireActor(locals);
  if (!can(actor, permission)) throw errors.forbidden(`Your role (${actor.role}) may not do this (${permission}).`);
  return actor;
}

/**
 * A condition limiting `column` (an installation id column) to the actor's installations, for the
 * WHERE clause of every query on installation data. Undefined for unscoped roles.
 */
export function scopeToInstallations(actor: Actor, column: AnyPgColumn | SQL): SQL | undefined {
  if (!actor.scoped) return undefined;
  if (actor.installationIds.length === 0) return sql`false`;
  // A raw column reference (for SQL with table aliases) compares against a uuid array parameter.
  if (!('table' in column)) return sql`${column} = any(${sql.param([...actor.installationIds])}::uuid[])`;
  return inArray(column, [...actor.installationIds]);
}

export function inScope(actor: Actor, installationId: string): boolean {
  return !actor.scoped || actor.installationIds.includes(installationId);
}

/**
 * The installation with `code` if the actor may work on it.
 * @throws 404 when there is no such installation, 403 when it is outside the actor's scope.
 */
export async function installationByCode(db: Db | Tx, actor: Actor, code: string) {
  const scope = scopeToInstallations(actor, installation.id);
  const [row] = await db
    .select()
    .from(installation)
    .where(scope ? and(eq(installation.code, code), scope) : eq(installation.code, code));
  if (row) return row;
  const [exists] = await db.select({ id: installation.id }).from(installation).where(eq(installation.code, code));
  if (exists) throw errors.forbidden(`You are not assigned to installation ${code}.`);
  throw errors.notFound(`No installation with code ${code}.`);
}
