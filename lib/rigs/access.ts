/** Who may see and manage which rig: the row-level rule lives with the rig queries (db/roles.ts). */
export { canManageAllRigs, canManageOwnRigs } from "@/db/roles";
