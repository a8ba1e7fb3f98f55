import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CONTENT_SECURITY_POLICY } from '../../main/electron/security';

describe('renderer/index.html', () => {
  // Expected values: the policy in main/electron/security; frame-ancestors is ignored in a meta element (W3C Content Security Policy, common practice).
  it('carries the desktop window’s Content-Security-Policy as a meta tag (frame-ancestors only works as a header)', () => {
    const html = readFileSync('renderer/index.html', 'utf8');
    const meta = /<meta http-equiv="Content-Security-Policy" content="([^"]+)"/.exec(html)?.[1];
    const expected = CONTENT_SECURITY_POLICY.split('; ').filter((directive) => !directive.startsWith('frame-ancestors')).join('; ');
    expect(meta).toBe(expected);
  });
});
