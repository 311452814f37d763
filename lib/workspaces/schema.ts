/** The views of the user's workspaces that cross to the shell and the API. */
import type { Role } from '@/lib/roles';

/** A workspace the user can switch to: an active membership. */
export interface WorkspaceChoice {
  workspaceId: string;
  name: string;
  role: Role;
}
