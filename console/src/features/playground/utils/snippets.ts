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

export const API_KEY_VARIABLE = 'LUMENWRIGHT_KEY';

export function curlSnippet({ origin, path, body }: SnippetRequest): string {
  const json = JSON.stringify(body, null, 2);
  return [
    `curl -sS -X POST ${shellQuote(`${origin}${path}`)} \\`,
    `  -H "Authorization: Bearer $${API_KEY_VARIABLE}" \\`,
    `  -H 'Content-Type: application/json' \\`,
    `  --data ${shellQuote(json)}`,
  ].join('\n');
}

/** `/v1/flash` -> `flash`: the SDK has one method per compute endpoint, named after it. */
export function sdkMethod(path: string): string {
  return path.replace(/^\/v1\//, '').replace(/[-/](\w)/g, (_, c: string) => c.toUpperCase());
}

export function sdkSnippet({ origin, path, body }: SnippetRequest): string {
  const json = JSON.stringify(body, null, 2);
  return [
    `import { Lumenwright, LumenwrightError } from '@lumenwright/sdk';`,
    ``,
    `const lw = new Lumenwright({`,
    `  apiKey: process.env.${API_KEY_VARIABLE}!,`,
    `  baseUrl: ${JSON.stringify(origin)},`,
    `});`,
    ``,
    `try {`,
    `  const result = await lw.${sdkMethod(path)}(${json.replace(/\n/g, '\n  ')});`,
    `  console.log(result);`,
    `} catch (error) {`,
    `  if (error instanceof LumenwrightError) console.error(error.status, error.message);`,
    `  else throw error;`,
    `}`,
  ].join('\n');
}
