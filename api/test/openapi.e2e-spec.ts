import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import {
  adminUserSchema, AUDIT_ACTIONS, auditEventSchema, pageOf, createApiTokenSchema, createScanSchema, modelInputSchema, modelUpdateSchema, potentialModelSchema, scanDetailSchema,
  scanGridSliceSchema, scanPlaneSchema, workerPoolSchema,
} from '@sixtyfold/shared';
import { z } from 'zod';
import { createTestApp, type TestApp } from './support/test-app';

// What the document must say about a schema: exactly zod's own JSON Schema of it.
const requestSchema = (schema: z.ZodType) => z.toJSONSchema(schema, { target: 'openapi-3.0', io: 'input', unrepresentable: 'any' });
const answerSchema = (schema: z.ZodType) => z.toJSONSchema(schema, { target: 'openapi-3.0', io: 'output', unrepresentable: 'any' });

interface Operation {
  summary?: string;
  security?: Record<string, string[]>[];
  parameters?: { name: string; in: string; required?: boolean; schema: Record<string, unknown> }[];
  requestBody?: { content: Record<string, { schema: unknown }> };
  responses: Record<string, { content?: Record<string, { schema: unknown }> }>;
}

describe('the OpenAPI document and its UI', () => {
  let t: TestApp;
  let doc: { openapi: string; paths: Record<string, Record<string, Operation>>; components: { securitySchemes: Record<string, unknown> }; security: unknown };

  beforeAll(async () => {
    t = await createTestApp();
    const res = await t.http().get('/api/docs/openapi.json');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    doc = res.body;
  });
  afterAll(() => t.close());

  it('is served without signing in and lists the scan routes with the shared scan schema', () => {
    expect(doc.openapi).toMatch(/^3\./);
    const create = doc.paths['/api/scans'].post;
    expect(create.requestBody!.content['application/json'].schema).toEqual(requestSchema(createScanSchema));
    expect(create.responses['201'].content!['application/json'].schema).toEqual(answerSchema(scanDetailSchema));
    expect(Object.keys(create.responses).sort()).toEqual(['201', '400', '401', '403', '404']);

    const list = doc.paths['/api/scans'].get;
    const status = list.parameters!.find((p) => p.name === 'status');
    expect(status).toMatchObject({ in: 'query', required: false, schema: { enum: ['draft', 'queued', 'running', 'completed', 'failed', 'cancelled'] } });
    const points = doc.paths['/api/scans/{id}/points'].get;
    expect(points.parameters!.map((p) => p.name)).toEqual(expect.arrayContaining(['id', 'format', 'page', 'ns_min']));
    expect(Object.keys(points.responses['200'].content!).sort()).toEqual(['application/json', 'application/vnd.apache.arrow.stream', 'text/csv']);
    expect(points.parameters!.find((p) => p.name === 'format')?.schema).toMatchObject({ enum: ['csv', 'json', 'arrow'] });
    // The merged table of a refined grid takes the same query, without the download.
    const merged = doc.paths['/api/scans/{id}/refinement/points'].get.parameters!.map((p) => p.name);
    expect(merged).toEqual(expect.arrayContaining(['id', 'page', 'sort', 'order', 'status', 'ns_min', 'deltaChi2_max', 'likelihood']));
    expect(merged).not.toContain('format');
    expect(doc.paths['/api/scans/{id}'].get.responses['200'].content!['application/json'].schema).toEqual(answerSchema(scanDetailSchema));
  });

  it('describes each likelihood parameter with both forms: a set and uploaded regions', () => {
    const routes: [string, string][] = [['/api/scans/{id}/points', 'likelihood'], ['/api/scans/{id}/refinement/points', 'likelihood'], ['/api/scans/{id}/grid', 'likelihood'], ['/api/scans/{id}/constraints', 'likelihood'], ['/api/scans/evidence', 'likelihoods']];
    for (const [route, name] of routes) {
      const parameter = doc.paths[route].get.parameters!.find((p) => p.name === name) as { description?: string } | undefined;
      expect({ route, description: parameter?.description }).toEqual({ route, description: expect.stringMatching(/key@version.*regions:<id>,<id>/s) });
    }
  });

  it('describes the model, plane, grid and pool routes with their shared schemas', () => {
    const json = (op: Operation, status: string) => op.responses[status].content!['application/json'].schema;
    const models = doc.paths['/api/models'];
    expect(models.post.requestBody!.content['application/json'].schema).toEqual(requestSchema(modelInputSchema));
    expect(json(models.post, '201')).toEqual(answerSchema(potentialModelSchema));
    expect(Object.keys(models.post.responses).sort()).toEqual(['201', '400', '401', '403', '404', '409']);
    const model = doc.paths['/api/models/{id}'];
    expect(model.patch.requestBody!.content['application/json'].schema).toEqual(requestSchema(modelUpdateSchema));
    expect(json(model.patch, '200')).toEqual(answerSchema(potentialModelSchema));
    expect(Object.keys(model.delete.responses).sort()).toEqual(['204', '400', '401', '403', '404']);
    const plane = doc.paths['/api/scans/{id}/plane'].get;
    expect(json(plane, '200')).toEqual(answerSchema(scanPlaneSchema));
    expect(plane.parameters!.find((p) => p.name === 'limit')).toMatchObject({ in: 'query', required: false, schema: { default: 20_000, maximum: 100_000 } });
    expect(json(doc.paths['/api/scans/{id}/grid'].get, '200')).toEqual(answerSchema(scanGridSliceSchema));
    expect(json(doc.paths['/api/workers/pool'].get, '200')).toEqual(answerSchema(workerPoolSchema));
  });

  it('declares the session cookie and bearer tokens, and which routes take which', () => {
    expect(doc.components.securitySchemes).toMatchObject({
      session: { type: 'apiKey', in: 'cookie', name: 'sixtyfold.sid' },
      token: { type: 'http', scheme: 'bearer' },
    });
    expect(doc.security).toEqual([{ session: [] }, { token: [] }]);
    expect(doc.paths['/api/health'].get.security).toEqual([{}]);
    for (const op of [doc.paths['/api/tokens'].get, doc.paths['/api/tokens'].post, doc.paths['/api/tokens/{id}'].delete, doc.paths['/api/auth/password'].post]) {
      expect(op.security).toEqual([{ session: [] }]);
    }
    expect(doc.paths['/api/tokens'].post.requestBody!.content['application/json'].schema).toEqual(requestSchema(createApiTokenSchema));
    const created = doc.paths['/api/tokens'].post.responses['201'].content!['application/json'].schema as { required: string[] };
    expect(created.required).toContain('token');
    expect(doc.paths['/api/auth/login'].post.requestBody).toBeDefined();
  });

  it('gives every route a summary and its success answer, the audit log and user list with their shared schemas', () => {
    const undocumented = Object.entries(doc.paths).flatMap(([route, ops]) =>
      Object.entries(ops)
        .filter(([, op]) => !op.summary || !Object.keys(op.responses).some((status) => /^2\d\d$/.test(status)))
        .map(([method]) => `${method.toUpperCase()} ${route}`),
    );
    expect(undocumented).toEqual([]);
    expect(Object.keys(doc.paths).length).toBeGreaterThanOrEqual(50);
    const audit = doc.paths['/api/admin/audit-events'].get;
    expect(audit.responses['200'].content!['application/json'].schema).toEqual(answerSchema(pageOf(auditEventSchema)));
    expect(audit.parameters!.find((p) => p.name === 'action')?.schema).toMatchObject({ enum: [...AUDIT_ACTIONS] });
    expect(doc.paths['/api/admin/users'].get.responses['200'].content!['application/json'].schema).toEqual(answerSchema(z.array(adminUserSchema)));
  });

  it('serves the docs page as HTML whose scripts all load from this server, as the CSP requires', async () => {
    const page = await t.http().get('/api/docs');
    expect(page.status).toBe(200);
    expect(page.headers['content-type']).toMatch(/text\/html/);
    expect(page.text).toContain('<div id="swagger-ui">');
    // script-src 'self' without 'unsafe-inline': every script must be a file from here.
    expect(page.headers['content-security-policy']).toContain("script-src 'self'");
    const scripts = [...page.text.matchAll(/<script([^>]*)>([\s\S]*?)<\/script>/g)];
    expect(scripts.length).toBeGreaterThanOrEqual(3);
    for (const [, attributes, body] of scripts) {
      expect(body.trim()).toBe('');
      const src = /src="([^"]+)"/.exec(attributes)?.[1];
      expect(src).toBeDefined();
      expect(src).not.toMatch(/^(https?:)?\/\//);
      const asset = await t.http().get(new URL(src!, `${t.url}/api/docs`).pathname);
      expect({ src, status: asset.status }).toEqual({ src, status: 200 });
      expect(asset.headers['content-type']).toMatch(/javascript/);
    }
    const init = await t.http().get('/api/docs/swagger-ui-init.js');
    expect(init.text).toContain('"/api/scans"');
  });
});
