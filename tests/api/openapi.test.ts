import { readFileSync } from 'node:fs';
import SwaggerParser from '@apidevtools/swagger-parser';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CLIENT_ENUMS_FILE,
  CLIENT_TYPES_FILE,
  OPENAPI_FILE,
  renderClientEnums,
  renderClientTypes,
  renderOpenApiJson,
} from '../../server/openapi/write.ts';
import { createTestApp, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('the OpenAPI document', () => {
  it('is committed fresh: run `npm run openapi` after changing a route or schema', async () => {
    const json = renderOpenApiJson();
    expect(readFileSync(OPENAPI_FILE, 'utf8'), 'openapi/openapi.json is stale').toBe(json);
    expect(readFileSync(CLIENT_TYPES_FILE, 'utf8'), 'src/api/schema.d.ts is stale').toBe(await renderClientTypes(json));
    expect(readFileSync(CLIENT_ENUMS_FILE, 'utf8'), 'src/api/openapi-enums.ts is stale').toBe(renderClientEnums(json));
  });

  it('is served at /api/v1/openapi.json without authentication, equal to the committed file', async () => {
    const res = await request(t.app).get('/api/v1/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body).toEqual(JSON.parse(readFileSync(OPENAPI_FILE, 'utf8')));
  });

  it('is a valid OpenAPI 3.1 document (swagger-parser)', async () => {
    const document = JSON.parse(readFileSync(OPENAPI_FILE, 'utf8'));
    expect(document.openapi).toBe('3.1.0');
    await expect(SwaggerParser.validate(document)).resolves.toBeTruthy();
  });

  it('gives every operation an id, a tag and documented problem responses', () => {
    const document = JSON.parse(readFileSync(OPENAPI_FILE, 'utf8')) as {
      paths: Record<string, Record<string, { operationId?: string; tags?: string[]; responses: Record<string, unknown> }>>;
    };
    const ids = new Set<string>();
    for (const [path, operations] of Object.entries(document.paths)) {
      for (const [method, operation] of Object.entries(operations)) {
        expect(operation.operationId, `${method} ${path}`).toBeTruthy();
        expect(ids.has(operation.operationId!), `duplicate ${operation.operationId}`).toBe(false);
        ids.add(operation.operationId!);
        expect(operation.tags?.length, `${method} ${path} tags`).toBeGreaterThan(0);
        expect(operation.responses).toHaveProperty('500');
      }
    }
  });
});
