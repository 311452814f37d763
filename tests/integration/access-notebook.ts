/** Authorisation-table rows for the notebook feature (merged into access-table.ts). */
import type { ActionCase, RouteCase } from './access-table';

export const NOTEBOOK_ROUTE_CASES: RouteCase[] = [];
export const NOTEBOOK_ACTION_CASES: ActionCase[] = [];
