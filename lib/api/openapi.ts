/**
 * The OpenAPI 3.1 description, generated from the same zod schemas the handlers validate
 * with. Each feature adds its operations to API_OPERATIONS; the authorisation test checks
 * that every route file under app/api/v1 has its operations listed here.
 */
import { z } from 'zod';
import { rolesWith, type Permission } from '@/lib/permissions';
import { inviteMemberSchema, updateMemberSchema } from '@/lib/members/schema';
import { createTokenSchema } from '@/lib/api-tokens/schema';

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
      schema: { type: 'string', format: 'uuid' },
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
