// Who may do what. Pure: no database, no Next, so it is unit-tested on its own. Every page, action
// and route handler asks here; nothing else in the code compares role names.
import { AppError } from "@/lib/domain/errors";
import { roles, type Role } from "@/lib/domain/vocabulary";

export { roles, type Role };

export const roleLabels: Record<Role, string> = {
  student: "Student",
  instructor: "Instructor",
  librarian: "Librarian",
  admin: "Admin",
};

const rules = {
  /** Create, invite, change role of and deactivate accounts. */
  "accounts:manage": ["admin"],
  /** Create classes and change who is in them. */
  "classes:manage": ["admin"],
  /** See classes and their members (instructors see the classes they belong to). */
  "classes:view": ["instructor", "admin"],
  /** Every class, not only those one is staff of: classes, their runs, reviews, records and assignments. */
  "classes:view-all": ["admin"],
  "audit:view": ["admin"],
  /** The school's settings: its time zone. */
  "settings:manage": ["admin"],
  /** Read the library: manuals, revisions that are ready, their pages and files. */
  "library:view": ["student", "instructor", "librarian", "admin"],
  /** Upload manuals and revisions, retry a failed ingest, see revisions that are not ready. */
  "library:manage": ["librarian", "admin"],
  /** Read task cards: students see published versions, authors drafts as well. */
  "cards:view": ["student", "instructor", "librarian", "admin"],
  /** Write task cards, duplicate any; edit, publish and archive one's own and those one co-authors. */
  "cards:author": ["instructor", "admin"],
  /** Edit, publish and archive anyone's card, and name its co-authors. */
  "cards:edit-any": ["admin"],
  /** Keep the list of curriculum subjects cards are filed under. */
  "subjects:manage": ["admin"],
  /** Give published card versions to a class or to students. */
  "assignments:manage": ["instructor", "admin"],
  /** Run assigned cards at the aircraft (a run belongs to one student). */
  "runs:do": ["student"],
  /** Review runs (of one's own classes, or assigned oneself; lib/server/runs/scope.ts): buy off, return, sign off. */
  "runs:review": ["instructor", "admin"],
  /** Records: students see their own; instructors those of the students they review; admins all. */
  "records:view": ["student", "instructor", "admin"],
  "records:view-all": ["instructor", "admin"],
  /** See the tool room's tools and kits (what a card's tool line names). */
  "tools:view": ["student", "instructor", "librarian", "admin"],
  /**
   * The tool-room attendant's work: tools and kits, labels, calibrations, lending and counting back
   * in. The school's librarian keeps the tool room as well as the library (no role of its own).
   */
  "tools:lend": ["librarian", "admin"],
  /** Clear a missing-tool hold (found, or lost with a note): the instructors of the student's classes (lib/server/runs/scope.ts). */
  "tools:clear-holds": ["instructor", "admin"],
  /** Keep the attendance registers of the classes one is staff of (admins: every class). */
  "attendance:take": ["instructor", "admin"],
  /** Import the school's copy of the certification standard's elements. */
  "standard:manage": ["admin"],
  /** The fleet, its findings and the hangar plan: everyone signed in reads them. */
  "fleet:view": ["student", "instructor", "librarian", "admin"],
  /** Add assets and places, correct their details and status. */
  "fleet:manage": ["admin"],
  /** Book an asset at a place (for the classes one teaches), move or cancel one's bookings and those of one's classes. */
  "hangar:book": ["instructor", "admin"],
  /** Write up what was found on an asset (students on their own runs). */
  "findings:file": ["student", "instructor", "admin"],
  /** Decide and close a finding: instructors of the run's student (lib/server/runs/scope.ts), admins. */
  "findings:decide": ["instructor", "admin"],
  /** The link to the local outbox (the page itself is open while the fake SMTP server runs). */
  "outbox:view": ["admin"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof rules;
export const permissionNames = Object.keys(rules) as Permission[];

export interface Actor {
  id: string;
  role: Role;
}

export function rolesWith(permission: Permission): readonly Role[] {
  return rules[permission];
}

export function can(actor: Actor | null | undefined, permission: Permission): boolean {
  return !!actor && (rules[permission] as readonly Role[]).includes(actor.role);
}

/** Throws 401 for nobody signed in and 403 for a role without the permission. */
export function assertCan(actor: Actor | null | undefined, permission: Permission): asserts actor is Actor {
  if (!actor) throw new AppError("unauthorized");
  if (!can(actor, permission)) throw new AppError("forbidden");
}

export function assertSignedIn(actor: Actor | null | undefined): asserts actor is Actor {
  if (!actor) throw new AppError("unauthorized");
}

export interface NavItem {
  href: string;
  label: string;
}

const navigation: { item: NavItem; permission?: Permission; onlyWithOutbox?: boolean }[] = [
  { item: { href: "/", label: "Home" } },
  { item: { href: "/search", label: "Search" }, permission: "library:view" },
  { item: { href: "/library", label: "Library" }, permission: "library:view" },
  { item: { href: "/cards", label: "Task cards" }, permission: "cards:view" },
  { item: { href: "/cart", label: "My work" }, permission: "runs:do" },
  { item: { href: "/review", label: "Review" }, permission: "runs:review" },
  { item: { href: "/calculators", label: "Calculators" } },
  { item: { href: "/fleet", label: "Fleet" }, permission: "fleet:view" },
  { item: { href: "/classes", label: "Classes" }, permission: "classes:view" },
  { item: { href: "/records", label: "Records" }, permission: "records:view" },
  { item: { href: "/tools", label: "Tool room" }, permission: "tools:lend" },
  { item: { href: "/accounts", label: "Accounts" }, permission: "accounts:manage" },
  { item: { href: "/standard", label: "Standard" }, permission: "standard:manage" },
  { item: { href: "/audit", label: "Audit log" }, permission: "audit:view" },
  { item: { href: "/settings", label: "School settings" }, permission: "settings:manage" },
  { item: { href: "/outbox", label: "Outbox" }, permission: "outbox:view", onlyWithOutbox: true },
];

export function navigationFor(actor: Actor, { outbox = false }: { outbox?: boolean } = {}): NavItem[] {
  return navigation.filter((n) => (!n.permission || can(actor, n.permission)) && (!n.onlyWithOutbox || outbox)).map((n) => n.item);
}
