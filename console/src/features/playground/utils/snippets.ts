/** "Copy as curl" and "copy as SDK call" for a playground calculation. */

/** Quote a string for a POSIX shell: wrap in single quotes, close-escape-reopen any inside. */
export function shellQuote(text: string): string {
  return `'${text.replace(/'/g, `'\\''`)}'`;
}

export interface SnippetRequest {
  /** API origin, e.g. the console's own origin. */
  origin: string;
  /** Operation path, e.g. `/v1/flash`. */
  path: string;
  /** The request body: the same fields as the shared function's input. */
  body: unknown;
}

export const API_KEY_VARIABLE = 'LUMENWRIGHT_API_KEY';

export function curlSnippet({ origin, path, body }: SnippetRequest): string {
  const json = JSON.stringify(body, null, 2);
  return [
    `curl -sS -X POST ${shellQuote(`${origin}${path}`)} \\`,
    `  -H "Authorization: Bearer $${API_KEY_VARIABLE}" \\`,
    `  -H 'Content-Type: application/json' \\`,
    `  --data ${shellQuote(json)}`,
  ].join('\n');
}

export function sdkSnippet({ origin, path, body }: SnippetRequest): string {
  const json = JSON.stringify(body, null, 2).replace(/\n/g, '\n  ');
  return [
    `import { createApiClient } from '@lumenwright/sdk';`,
    ``,
    `const client = createApiClient({`,
    `  baseUrl: ${JSON.stringify(origin)},`,
    `  headers: { Authorization: \`Bearer \${process.env.${API_KEY_VARIABLE}}\` },`,
    `});`,
    ``,
    `const { data, error } = await client.POST(${JSON.stringify(path)}, {`,
    `  body: ${json},`,
    `});`,
    `if (error) throw new Error(error.detail ?? error.title);`,
    `console.log(data);`,
  ].join('\n');
}
