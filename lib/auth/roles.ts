/** The five roles of Loopkeeper and what each may do. Pure: shared by server guards and UI hints. */
export const ROLES = ["admin", "engineer", "release_manager", "support", "viewer"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Administrator",
  engineer: "Firmware engineer",
  release_manager: "Release manager",
  support: "Support",
  viewer: "Viewer",
};

/**
 * Capabilities, each granted to a fixed set of roles. The server checks these on every
 * page, route and action; the UI only uses them to decide what to show.
 */
export const CAPABILITIES = {
  /** Read the registry, profiles, builds and lots. */
  read: ["admin", "engineer", "release_manager", "support", "viewer"],
  /** Create and edit components, cooler models, boards; author and publish profiles. */
  "registry:write": ["admin", "engineer"],
  /** Create builds and ask for their review. */
  "build:create": ["admin", "engineer", "release_manager"],
  /** Approve or request changes on others' builds. */
  "build:review": ["admin", "engineer"],
  /** Promote builds past review, attach lab evidence, record waivers. */
  "build:promote": ["admin", "release_manager"],
  /** Withdraw a build with a reason. */
  "build:withdraw": ["admin", "release_manager"],
  /** Record production lots (form, CSV, factory stations). */
  "lot:write": ["admin", "release_manager"],
  /** Serial lookup, dump identification, shipped-board exports. */
  support: ["admin", "engineer", "release_manager", "support"],
  /** Users, roles, audit log, local mailbox. */
  admin: ["admin"],
} as const satisfies Record<string, readonly Role[]>;

export type Capability = keyof typeof CAPABILITIES;

export function can(role: Role | null | undefined, capability: Capability): boolean {
  if (!role) return false;
  return (CAPABILITIES[capability] as readonly Role[]).includes(role);
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}
