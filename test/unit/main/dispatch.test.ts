import { writeFileSync } from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CHANNELS } from '@shared/model/channels';
import { contract } from '@shared/model/contract';
import { dispatch } from '../../../src-main/handlers/dispatch';
import { testHandlerContext } from '../helpers/handler-context';

const { base, ctx } = testHandlerContext('dispatch');

describe('dispatch refuses payloads that break their schema', () => {
  it.each([
    ['appInfo', { extra: 1 }],
    ['appInfo', 'a string'],
    ['appInfo', null],
    ['appInfo', [1, 2]],
    ['loadDemo', { which: 'binary-nonsense' }],
    ['loadDemo', { which: 42 }],
    ['loadDemo', { which: 'continuous', path: '/etc/passwd' }],
    ['loadDemo', { __proto__: { polluted: true } }],
  ])('%s with %j → invalid-request', async (channel, payload) => {
    const answer = await dispatch(channel, payload, ctx);
    expect(answer).toMatchObject({ ok: false, error: { code: 'invalid-request' } });
  });

  it.each([['constructor'], ['__proto__'], ['toString'], [''], ['appInfo '], [42], [null]])(
    'an unknown channel %j is refused',
    async (channel) => {
      const answer = await dispatch(channel, {}, ctx);
      expect(answer).toMatchObject({ ok: false, error: { code: 'unknown-channel' } });
    },
  );

  it('for every channel, any payload its schema rejects is refused without running the handler', async () => {
    for (const channel of CHANNELS) {
      await fc.assert(
        fc.asyncProperty(fc.anything(), async (payload) => {
          fc.pre(!contract[channel].request.safeParse(payload).success);
          const answer = await dispatch(channel, payload, ctx);
          expect(answer).toMatchObject({ ok: false, error: { code: 'invalid-request' } });
        }),
        { numRuns: 200 },
      );
    }
  });

  it('a handler that touches the disk answers ok for a valid request, and a readable error otherwise', async () => {
    const missing = await dispatch('loadDemo', { which: 'continuous' }, ctx);
    expect(missing).toMatchObject({ ok: false, error: { code: 'demo-missing' } });
    const demoDir = path.join(base, 'demo');
    await import('node:fs/promises').then((fs) => fs.mkdir(demoDir, { recursive: true }));
    writeFileSync(
      path.join(demoDir, 'consortium-continuous.plumb'),
      JSON.stringify({ format: 'plumbline-plan', schemaVersion: 1, name: 'T', outcome: 'continuous', populations: [] }),
    );
    const found = await dispatch('loadDemo', { which: 'continuous' }, ctx);
    expect(found).toMatchObject({ ok: true, value: { project: { name: 'T', populations: [] } } });
  });
});
