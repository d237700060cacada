import { describe, expect, it } from 'vitest';
import { crossSiteWriteRefusal, originOf } from '../../backend/auth/same-origin';

const here = 'https://conductory.example';

// Expected answers: OWASP CSRF Prevention Cheat Sheet ("Verifying Origin with standard headers")
// and the WHATWG URL standard's origin serialization (scheme, host and port; default port dropped).
describe('crossSiteWriteRefusal', () => {
  const cases: Array<[string, Partial<Parameters<typeof crossSiteWriteRefusal>[0]>, boolean]> = [
    ['a GET from anywhere', { method: 'GET', origin: 'https://evil.example' }, true],
    ['a HEAD without Origin', { method: 'HEAD', origin: undefined }, true],
    ['an OPTIONS with Origin null', { method: 'OPTIONS', origin: 'null' }, true],
    ['a POST from this origin', { origin: here }, true],
    ['a POST from this origin, upper-case host', { origin: 'https://Conductory.Example' }, true],
    ['a lower-case method', { method: 'delete', origin: here }, true],
    ['a POST without Origin', { origin: undefined }, false],
    ['a POST with an empty Origin', { origin: '' }, false],
    [
      'without Origin, Sec-Fetch-Site same-origin',
      { origin: undefined, secFetchSite: 'same-origin' },
      true,
    ],
    [
      'without Origin, Sec-Fetch-Site same-site',
      { origin: undefined, secFetchSite: 'same-site' },
      false,
    ],
    ['without Origin, Sec-Fetch-Site none', { origin: undefined, secFetchSite: 'none' }, false],
    ['Origin null', { origin: 'null' }, false],
    ['Origin NULL', { origin: 'NULL' }, false],
    ['a malformed Origin', { origin: 'http://[::1' }, false],
    ['not a URL at all', { origin: '%%%' }, false],
    ['an Origin with a path', { origin: `${here}/page` }, false],
    ['an Origin with credentials', { origin: 'https://user@conductory.example' }, false],
    ['another scheme', { origin: 'http://conductory.example' }, false],
    ['another port', { origin: 'https://conductory.example:8443' }, false],
    ['the default port spelled out', { origin: 'https://conductory.example:443' }, false],
    ['another host', { origin: 'https://evil.example' }, false],
    ['a sub-domain', { origin: 'https://www.conductory.example' }, false],
    ['a javascript: origin', { origin: 'javascript:alert(1)' }, false],
    ['a file: origin', { origin: 'file:///etc/passwd' }, false],
    [
      'this origin but Sec-Fetch-Site cross-site',
      { origin: here, secFetchSite: 'cross-site' },
      false,
    ],
    [
      'this origin, Sec-Fetch-Site same-origin',
      { origin: here, secFetchSite: 'same-origin' },
      true,
    ],
  ];
  it.each(cases)('%s → allowed %s', (_name, input, allowed) => {
    const refusal = crossSiteWriteRefusal({
      method: 'POST',
      origin: undefined,
      secFetchSite: undefined,
      expected: [here],
      ...input,
    });
    expect(refusal === null).toBe(allowed);
    if (!allowed) expect(typeof refusal).toBe('string');
  });

  it('never throws, whatever the headers and expected origins hold', () => {
    const odd = ['', ' ', 'null', '://', 'http://', 'http://a b', '\u0000', 'x'.repeat(10_000)];
    for (const origin of odd)
      for (const expected of [[], [''], ['not a url'], [undefined], ['http://a b']])
        expect(() =>
          crossSiteWriteRefusal({ method: 'PATCH', origin, secFetchSite: origin, expected }),
        ).not.toThrow();
  });

  it('a request-derived expected origin compares scheme, host and port', () => {
    const write = (origin: string) =>
      crossSiteWriteRefusal({
        method: 'POST',
        origin,
        secFetchSite: undefined,
        expected: ['http://127.0.0.1:3000'],
      });
    expect(write('http://127.0.0.1:3000')).toBeNull();
    expect(write('http://127.0.0.1:3001')).not.toBeNull();
    expect(write('https://127.0.0.1:3000')).not.toBeNull();
    expect(write('http://localhost:3000')).not.toBeNull();
  });
});

describe('originOf', () => {
  it('keeps scheme, host and port of http(s) URLs and nothing else', () => {
    expect(originOf('https://conductory.example/api/v1?x=1')).toBe('https://conductory.example');
    expect(originOf('http://127.0.0.1:3000/')).toBe('http://127.0.0.1:3000');
    expect(originOf('HTTP://Example.COM:80')).toBe('http://example.com');
    expect(originOf('ftp://example.com')).toBeUndefined();
    expect(originOf('')).toBeUndefined();
    expect(originOf(undefined)).toBeUndefined();
    expect(originOf('not a url')).toBeUndefined();
  });
});
