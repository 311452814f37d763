/** Authorisation-table rows for the uploads feature (merged into access-table.ts). */
import type { ActionCase, RouteCase } from './access-table';

export const UPLOADS_ROUTE_CASES: RouteCase[] = [];
export const UPLOADS_ACTION_CASES: ActionCase[] = [];
