import {
  ImportIdParams,
  ImportListQuerySchema,
  ImportListSchema,
  ImportPreviewRequestSchema,
  ImportPreviewSchema,
  ImportSchema,
  ImportUploadSchema,
} from '../../domain/imports/imports.schemas.ts';
import { getImport, getImportFile, listImportsPage, previewImport } from '../../domain/imports/imports.service.ts';
import { uploadImportOrRecordFailure } from '../../domain/imports/import-events.ts';
import { AUTO_DETECTION_DESCRIPTION } from '../../domain/imports/import-profiles.schemas.ts';
import { SAMPLE_TEXT_LIMITS as L } from '../../domain/samples/sample-limits.ts';
import { defineRoute } from '../../http/route.ts';
import { z } from '../../lib/zod.ts';
import { singleFileUpload } from '../../http/upload.ts';

// The extensions fileProblem() (imports.service.ts) adds, for clients that show the lines.
const FILE_ISSUES_NOTE =
  'For a file problem, `errors[]` locates each issue as `file:line 12:Mn`; the same issues come structured in `issues[]` (`line`, `column`, `message`, `code`), at most 200, with their full number in `errors_total`.';

const COLUMN_REVIEW_NOTE =
  "Element columns that are often misread are named before anything is stored, in `layout.columns[].attention` and as `warnings` with the same code: `computed_index` (a `CE` header, usually the carbon equivalent, would be stored as cerium), `balance_element` (the method's base element, usually printed as the balance), `not_in_method` (an element the method does not list). An import profile decides each one (`ignore_columns`, `element_columns`, `columns.fields`, `keep_columns`); the warning then goes away. The API imports without a decision (the report keeps the warnings); the console waits for one on `computed_index` and `balance_element`.";

export const importRoutes = [
  defineRoute({
    method: 'post',
    path: '/imports',
    operationId: 'uploadImport',
    summary: 'Upload an instrument result file',
    description:
      'The raw bytes are kept with their SHA-256. Uploading the same bytes again returns the earlier import with 200 and creates nothing. By default a file is imported all or nothing: one unreadable value answers 422 with `errors[]` naming line and column (`file:line 12:Mn`), and the database is unchanged.\n\n' +
      `${COLUMN_REVIEW_NOTE}\n\n` +
      `Cells obey the limits of a JSON push: sample code, heat and grade at most ${L.identification} characters, identification field names ${L.fieldName} and values ${L.fieldValue}, at most ${L.fields} fields per line, element cells ${L.value}; a longer cell is an issue of its line and column (\`too_long\`, \`too_many_fields\`, \`invalid_value\`).\n\n` +
      AUTO_DETECTION_DESCRIPTION,
    tag: 'Imports',
    access: { scope: 'imports:write' },
    body: ImportUploadSchema,
    bodyContentType: 'multipart/form-data',
    before: (ctx) => [singleFileUpload('file', ctx.config.importMaxBytes)],
    responses: {
      200: { description: 'These bytes were imported before: the earlier import, unchanged.', schema: ImportSchema },
      201: {
        description: 'Imported; the report lists what was created, warnings and rejected lines.',
        schema: ImportSchema,
        headers: { Location: 'The new import.' },
      },
      409: {
        description:
          'Correction sets for the instrument and method were activated again and again while the file was being imported (its samples are built against the sets in force when they are stored): upload it again. Or a request with the same `Idempotency-Key` is still being processed.',
      },
      413: { description: "The file exceeds IMPORT_MAX_BYTES; the problem's `limit_bytes` gives the limit." },
      415: { description: 'Not a multipart/form-data request.' },
      422: {
        description: `The file cannot be read, a value is broken (all-or-nothing), or a referenced instrument, method or profile does not exist; an \`import.failed\` event records the refusal. ${FILE_ISSUES_NOTE}`,
      },
    },
    async handler({ body, auth, req, ctx, reply }) {
      const { created, record } = await uploadImportOrRecordFailure(ctx, auth, body, req.requestId);
      if (created) reply(201, record, { Location: `/api/v1/imports/${record.id}` });
      else reply(200, record);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/imports/preview',
    operationId: 'previewImport',
    summary: 'Read a result file without storing anything',
    description: `Shows how the file would be read: recognised columns, the first samples, warnings and rejected lines, and whether these bytes were imported before.\n\n${COLUMN_REVIEW_NOTE}`,
    tag: 'Imports',
    access: { scope: 'imports:write' },
    body: ImportPreviewRequestSchema,
    bodyContentType: 'multipart/form-data',
    before: (ctx) => [singleFileUpload('file', ctx.config.importMaxBytes)],
    responses: {
      200: { description: 'How the file reads.', schema: ImportPreviewSchema },
      413: { description: "The file exceeds IMPORT_MAX_BYTES; the problem's `limit_bytes` gives the limit." },
      415: { description: 'Not a multipart/form-data request.' },
      422: { description: `The file cannot be read as result data, or a reference does not exist. ${FILE_ISSUES_NOTE}` },
    },
    async handler({ body, auth, ctx, reply }) {
      reply(200, await previewImport(ctx, auth, body));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/imports',
    operationId: 'listImports',
    summary: 'List imports, newest first',
    tag: 'Imports',
    access: { scope: 'samples:read' },
    query: ImportListQuerySchema,
    responses: { 200: { description: 'A page of imports.', schema: ImportListSchema } },
    async handler({ query, auth, ctx, reply }) {
      reply(200, await listImportsPage(ctx, auth, query));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/imports/{id}',
    operationId: 'getImport',
    summary: 'Get an import and its report',
    tag: 'Imports',
    access: { scope: 'samples:read' },
    params: ImportIdParams,
    responses: { 200: { description: 'The import.', schema: ImportSchema }, 404: { description: 'No such import.' } },
    async handler({ params, auth, ctx, reply }) {
      reply(200, await getImport(ctx, auth, params.id));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/imports/{id}/file',
    operationId: 'downloadImportFile',
    summary: 'Download the raw file exactly as uploaded',
    description:
      'Always an attachment, served as `text/csv` with the charset the file was read in (`utf-8` or `windows-1252`) and `X-Content-Type-Options: nosniff`, whatever Content-Type the uploader sent (it stays in `file.content_type` of the import), so that no browser runs the bytes as a page or script.',
    tag: 'Imports',
    access: { scope: 'samples:read' },
    params: ImportIdParams,
    responses: {
      200: {
        description: 'The bytes as uploaded, as an attachment, with their SHA-256 in the `x-content-sha256` header.',
        contentType: 'text/csv',
        schema: z.string().openapi({ format: 'binary' }),
      },
      404: { description: 'No such import.' },
    },
    async handler({ params, auth, res, ctx }) {
      const file = await getImportFile(ctx, auth, params.id);
      // attachment() first: it would set a Content-Type from the file name's extension.
      res.attachment(file.file_name);
      res.setHeader('Content-Type', file.media_type);
      res.setHeader('X-Content-Type-Options', 'nosniff');
      res.setHeader('x-content-sha256', file.sha256);
      res.send(Buffer.from(file.content));
    },
  }),
];
