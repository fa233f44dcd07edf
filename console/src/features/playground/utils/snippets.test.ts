import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { curlSnippet, sdkMethod, sdkSnippet, shellQuote } from './snippets';

const body = { notes: "it's windy", distance: 2.5, distanceUnit: 'm', gels: [{ miredShift: 81 }] };

describe('copy snippets', () => {
  // POSIX shell quoting (IEEE Std 1003.1, Shell Command Language 2.2.2): nothing is special
  // inside single quotes, so a quote is written as '\'' . Checked by a real /bin/sh.
  it('quotes text so /bin/sh hands it back unchanged', () => {
    for (const text of ["it's", '$HOME `date` "x"', 'a\nb', "''", '']) {
      const echoed = execFileSync('/bin/sh', ['-c', `printf '%s' ${shellQuote(text)}`], {
        encoding: 'utf8',
      });
      expect(echoed).toBe(text);
    }
  });

  it('builds a curl command whose --data is the exact JSON body', () => {
    const command = curlSnippet({ origin: 'http://127.0.0.1:3000', path: '/v1/flash', body });
    expect(command).toContain("-X POST 'http://127.0.0.1:3000/v1/flash'");
    expect(command).toContain('Authorization: Bearer $LUMENWRIGHT_KEY');
    const data = command.slice(command.indexOf('--data ') + '--data '.length);
    const sent = execFileSync('/bin/sh', ['-c', `printf '%s' ${data}`], { encoding: 'utf8' });
    expect(JSON.parse(sent)).toEqual(body);
  });

  it('builds an SDK call on the method named after the endpoint, with the same body', () => {
    const code = sdkSnippet({ origin: 'http://127.0.0.1:3000', path: '/v1/flash', body });
    expect(code).toContain("import { Lumenwright, LumenwrightError } from '@lumenwright/sdk';");
    expect(code).toContain('baseUrl: "http://127.0.0.1:3000"');
    const start = code.indexOf('lw.flash(') + 'lw.flash('.length;
    const literal = code.slice(start, code.indexOf(');\n', start));
    expect(JSON.parse(literal)).toEqual(body);
    expect(sdkMethod('/v1/setup')).toBe('setup');
    expect(sdkMethod('/v1/twilight')).toBe('twilight');
  });
});
