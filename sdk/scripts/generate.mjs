#!/usr/bin/env node
// Generates the SDK's types from the committed spec: `node scripts/generate.mjs [spec] [out]`
// (defaults: ../openapi/openapi.json, src/generated/schema.ts). The same as the openapi-typescript
// CLI with default options, plus one transform the CLI cannot take: a binary string (OpenAPI 3.1
// `contentMediaType`, or 3.0's `format: binary`) is typed as a Blob, so an upload's file part
// reads as bytes rather than text (openapi-typescript's documented `transform` option).
// The workspace drift check runs this same file.
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import openapiTS, { astToString, COMMENT_HEADER } from 'openapi-typescript';
import ts from 'typescript';

const here = path.dirname(fileURLToPath(import.meta.url));
const [specArg, outArg] = process.argv.slice(2);
const spec = path.resolve(specArg ?? path.join(here, '../../openapi/openapi.json'));
const out = path.resolve(outArg ?? path.join(here, '../src/generated/schema.ts'));

/** True for a schema describing raw bytes rather than text. */
export function isBinary(schema) {
  return (
    schema?.type === 'string' &&
    (schema.format === 'binary' || typeof schema.contentMediaType === 'string')
  );
}

const ast = await openapiTS(pathToFileURL(spec), {
  transform(schema) {
    if (isBinary(schema)) return ts.factory.createTypeReferenceNode('Blob');
    return undefined;
  },
});
fs.mkdirSync(path.dirname(out), { recursive: true });
fs.writeFileSync(out, `${COMMENT_HEADER}${astToString(ast)}`);
