import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { listRoutes } from './support/route-list.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

let t: TestApp;
let engineer: ApiClient;
beforeAll(async () => {
  t = await createTestApp();
  engineer = await signedInAs(t.app, 'engineer');
});
afterAll(() => t.close());

describe('GET /api/openapi.json', () => {
  it('documents exactly the mounted routes (a new route without documentation fails here)', async () => {
    const res = await engineer.get('/api/openapi.json');
    expect(res.status).toBe(200);
    const documented = Object.entries(res.body.paths as Record<string, Record<string, unknown>>)
      .flatMap(([path, operations]) =>
        Object.keys(operations).map((method) => `${method.toUpperCase()} /api${path.replace(/\{(\w+)\}/g, ':$1')}`),
      )
      .sort();
    expect(documented).toEqual(listRoutes(t.app));
  });

  it('takes request bodies and query parameters from the zod schemas the routes validate with', async () => {
    const { paths } = (await engineer.get('/api/openapi.json')).body;
    const createDesign = paths['/designs'].post.requestBody.content['application/json'].schema;
    expect(createDesign.required).toEqual(expect.arrayContaining(['title', 'spec']));
    const list = paths['/designs'].get.parameters.map((p: { name: string }) => p.name);
    expect(list).toEqual(expect.arrayContaining(['scope', 'q', 'sort', 'page', 'pageSize']));
    const upload = paths['/catalogue/cores/import/commit'].post.requestBody.content['multipart/form-data'].schema;
    expect(Object.keys(upload.properties)).toEqual(['file', 'decisions']);
    const release = paths['/revisions/{id}/release'].post;
    expect(release.parameters[0]).toMatchObject({ name: 'id', in: 'path', required: true });
    expect(release.requestBody.content['application/json'].schema.properties).toHaveProperty('quantity');
    expect(paths['/health'].get.security).toEqual([]);
    expect(paths['/shop/orders/{id}/sheet.pdf'].get.responses['200'].content).toHaveProperty('application/pdf');
    const order = paths['/shop/orders/{id}'].get.responses['200'].content['application/json'].schema;
    expect(order.properties.canRecord.type).toBe('boolean');
    expect(order.properties.sheet.properties.tests.required).toEqual(['inductance', 'resistanceMax20', 'hipot']);
    expect(paths['/shop/orders/{id}/units'].post.responses).toHaveProperty('201');
    expect(paths['/shop/prediction-report'].get.description).toMatch(/^Who: engineer, reviewer, admin\./);
  });

  it('describes the calculation and comparison routes with request schemas generated from the zod schemas', async () => {
    const res = await engineer.get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    for (const path of [
      '/calc/operating-point',
      '/calc/core-loss',
      '/calc/search',
      '/calc/evaluate',
      '/compare/curves',
      '/compare/design',
      '/compare/saved-design',
    ]) {
      expect(res.body.paths[path].post.requestBody.content['application/json'].schema).toBeTypeOf('object');
    }
    const op = res.body.paths['/calc/operating-point'].post.requestBody.content['application/json'].schema;
    expect(op.properties.vinMin.minimum).toBe(0.5);
    expect(op.properties.frequency.description).toMatch(/Switching frequency/);
    const saved = res.body.paths['/compare/saved-design'].post.requestBody.content['application/json'].schema;
    expect(saved.required).toEqual(['designId', 'revision']);
  });

  it('generates declared routes (shared/api) with their query and answer schemas and who may call them', async () => {
    const { paths, components } = (await engineer.get('/api/openapi.json')).body;
    const audit = paths['/admin/audit'].get;
    expect(audit.parameters.map((p: { name: string; in: string }) => `${p.in}:${p.name}`)).toEqual(['query:offset', 'query:limit']);
    expect(audit.description).toMatch(/^Who: admin\./);
    expect(audit.responses['200'].content['application/json'].schema.properties.entries.type).toBe('array');
    expect(audit.responses['401'].content['application/json'].schema.$ref).toBe('#/components/schemas/Error');
    const cores = paths['/catalogue/cores'].get.responses['200'].content['application/json'].schema;
    expect(cores.properties.cores.items.properties.origin.enum).toEqual(['shipped', 'user']);
    expect(paths['/inbox'].get.responses['200'].content['application/json'].schema.properties.items.items.required).toContain('kind');
    expect(paths['/health'].get.responses['200'].content['application/json'].schema.properties.database.enum).toEqual(['up', 'down']);
    expect(components.schemas.Error.required).toEqual(['error']);
  });
});

describe('admin user edits', () => {
  it('say what the schema allows: display name, role, disabled — no e-mail or password', async () => {
    const { paths } = (await engineer.get('/api/openapi.json')).body;
    const patch = paths['/admin/users/{id}'].patch;
    expect(Object.keys(patch.requestBody.content['application/json'].schema.properties).sort()).toEqual([
      'disabled',
      'displayName',
      'role',
    ]);
    expect(patch.summary).not.toMatch(/e-mail|password/i);
    expect(patch.summary).toMatch(/display name/);
  });
});
