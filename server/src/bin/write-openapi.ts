// Writes openapi/openapi.json without opening a port or a database connection.
import 'reflect-metadata';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createPreviewApp } from '../app.factory.js';

const here = path.dirname(fileURLToPath(import.meta.url));
const out = path.resolve(process.argv[2] ?? path.join(here, '../../../openapi/openapi.json'));

const app = await createPreviewApp();
const { buildOpenApiDocument } = await import('../openapi.js');
const doc = buildOpenApiDocument(app);
fs.mkdirSync(path.dirname(out), { recursive: true });
fs.writeFileSync(out, JSON.stringify(doc, null, 2) + '\n');
await app.close();
console.log(`wrote ${path.relative(process.cwd(), out)}`);
