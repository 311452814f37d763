/**
 * The OpenAPI 3.1 description, generated from the same zod schemas the handlers validate
 * with. Each feature adds its operations to API_OPERATIONS; the authorisation test checks
 * that every route file under app/api/v1 has its operations listed here.
 */
import { z } from 'zod';
import { rolesWith, type Permission } from '@/lib/permissions';
import { inviteMemberSchema, updateMemberSchema } from '@/lib/members/schema';
import { createTokenSchema } from '@/lib/api-tokens/schema';
import { ingredientInputSchema } from '@/lib/ingredients/schema';
import { calcBatchSchema, createFormulaSchema, reviseFormulaSchema } from '@/lib/formulas/schema';

export interface ApiOperation {
  method: 'get' | 'post' | 'patch' | 'put' | 'delete';
  /** OpenAPI path, with {param} placeholders. */
  path: string;
  summary: string;
  tag: string;
  /** null for public operations. */
  permission: Permission | null;
  request?: z.ZodType;
  okStatus?: number;
}

export const API_OPERATIONS: ApiOperation[] = [
  { method: 'get', path: '/api/v1/me', summary: 'The caller, their current workspace and role, and the workspaces they can switch to', tag: 'Account', permission: 'account.self' },
  { method: 'get', path: '/api/v1/members', summary: 'Members and open invitations of the workspace', tag: 'Members', permission: 'members.manage' },
  { method: 'post', path: '/api/v1/members', summary: 'Invite a member by e-mail with a role', tag: 'Members', permission: 'members.manage', request: inviteMemberSchema, okStatus: 201 },
  { method: 'patch', path: '/api/v1/members/{membershipId}', summary: "Change a member's role or deactivate/reactivate them (the last administrator cannot be removed: 409)", tag: 'Members', permission: 'members.manage', request: updateMemberSchema },
  { method: 'delete', path: '/api/v1/invitations/{invitationId}', summary: 'Revoke an open invitation', tag: 'Members', permission: 'members.manage' },
  { method: 'get', path: '/api/v1/tokens', summary: "The caller's personal API tokens in this workspace (never the secrets)", tag: 'Account', permission: 'tokens.manage' },
  { method: 'post', path: '/api/v1/tokens', summary: 'Create a personal API token; the secret is in this response only', tag: 'Account', permission: 'tokens.manage', request: createTokenSchema, okStatus: 201 },
  { method: 'delete', path: '/api/v1/tokens/{tokenId}', summary: 'Revoke one of your tokens', tag: 'Account', permission: 'tokens.manage' },
  { method: 'get', path: '/api/v1/ingredients', summary: 'The ingredient library (query: q, kind, sort, dir, archived=include|only)', tag: 'Ingredients', permission: 'ingredients.read' },
  { method: 'post', path: '/api/v1/ingredients', summary: 'Add an ingredient of your own', tag: 'Ingredients', permission: 'ingredients.write', request: ingredientInputSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/ingredients/export', summary: 'The ingredient library as CSV (same query as the list)', tag: 'Ingredients', permission: 'ingredients.read' },
  { method: 'get', path: '/api/v1/ingredients/{ingredientId}', summary: 'One ingredient', tag: 'Ingredients', permission: 'ingredients.read' },
  { method: 'patch', path: '/api/v1/ingredients/{ingredientId}', summary: "Replace an ingredient's values (a typical value becomes the workspace's edited value)", tag: 'Ingredients', permission: 'ingredients.write', request: ingredientInputSchema },
  { method: 'delete', path: '/api/v1/ingredients/{ingredientId}', summary: 'Archive an ingredient (old revisions keep their snapshot)', tag: 'Ingredients', permission: 'ingredients.write' },
  { method: 'get', path: '/api/v1/formulas', summary: 'Formulas with the headline results of their latest revision (query: q)', tag: 'Formulas', permission: 'formulas.read' },
  { method: 'post', path: '/api/v1/formulas', summary: 'Create a formula (revision 1); lines may be in g, kg, lb, oz or % of fruit and are stored in grams', tag: 'Formulas', permission: 'formulas.write', request: createFormulaSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/formulas/{formulaId}', summary: 'A formula at its latest revision, with the full computation', tag: 'Formulas', permission: 'formulas.read' },
  { method: 'get', path: '/api/v1/formulas/{formulaId}/revisions', summary: 'Revision history, newest first', tag: 'Formulas', permission: 'formulas.read' },
  { method: 'post', path: '/api/v1/formulas/{formulaId}/revisions', summary: 'Save a new revision; 409 when baseRevision is no longer the latest (unless force)', tag: 'Formulas', permission: 'formulas.write', request: reviseFormulaSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/formulas/{formulaId}/revisions/{number}', summary: 'One revision', tag: 'Formulas', permission: 'formulas.read' },
  { method: 'post', path: '/api/v1/calc/batch', summary: 'Compute a posted formula (mass balance, end point, water activity, compliance, cautions); stores nothing', tag: 'Formulas', permission: 'calc.run', request: calcBatchSchema },
  { method: 'get', path: '/api/v1/openapi.json', summary: 'This description', tag: 'Meta', permission: null },
];

const errorSchema = {
  type: 'object',
  required: ['error'],
  properties: {
    error: {
      type: 'object',
      required: ['code', 'message'],
      properties: {
        code: { type: 'string' },
        message: { type: 'string' },
        fields: { type: 'object', additionalProperties: { type: 'array', items: { type: 'string' } } },
      },
    },
  },
} as const;

function schemaOf(schema: z.ZodType) {
  return z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any', target: 'draft-2020-12' });
}

export function buildOpenApiDocument(serverUrl: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const op of API_OPERATIONS) {
    const params = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => ({
      name: m[1],
      in: 'path',
      required: true,
      schema: m[1] === 'number' ? { type: 'integer', minimum: 1 } : { type: 'string', format: 'uuid' },
    }));
    const errorRef = { description: 'Error', content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } };
    paths[op.path] ??= {};
    paths[op.path][op.method] = {
      summary: op.summary,
      tags: [op.tag],
      ...(op.permission
        ? { security: [{ bearerToken: [] }, { sessionCookie: [] }], 'x-setwell-roles': rolesWith(op.permission) }
        : { security: [] }),
      ...(params.length ? { parameters: params } : {}),
      ...(op.request ? { requestBody: { required: true, content: { 'application/json': { schema: schemaOf(op.request) } } } } : {}),
      responses: {
        [String(op.okStatus ?? 200)]: { description: 'Success', content: { 'application/json': { schema: { type: 'object' } } } },
        ...(op.permission ? { 401: errorRef, 403: errorRef } : {}),
        ...(params.length ? { 404: errorRef } : {}),
        ...(op.request ? { 400: errorRef, 422: errorRef } : {}),
        ...(op.method !== 'get' ? { 409: errorRef } : {}),
      },
    };
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Setwell API',
      version: '1',
      description:
        'JSON API of Setwell. Authenticate with a personal API token (Authorization: Bearer swt_…) or the browser session. Errors always have the shape { "error": { "code", "message", "fields"? } }.',
    },
    servers: [{ url: serverUrl }],
    paths,
    components: {
      schemas: { Error: errorSchema },
      securitySchemes: {
        bearerToken: { type: 'http', scheme: 'bearer', description: 'A personal API token from Settings → API tokens' },
        sessionCookie: { type: 'apiKey', in: 'cookie', name: 'next-auth.session-token', description: 'Browser session; writes must carry a same-origin Origin header' },
      },
    },
  };
}
