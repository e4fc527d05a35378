import { describe, expect, it } from 'vitest';
import { CHANNELS, buildBridge } from '@shared/model/channels';
import { contract } from '@shared/model/contract';
import { handlers } from '../../../src-main/handlers/index';

describe('the IPC contract is declared once', () => {
  it('the dependency-free channel list, the contract and the handler table name the same channels', () => {
    const listed = [...CHANNELS].sort();
    expect(Object.keys(contract).sort()).toEqual(listed);
    expect(Object.keys(handlers).sort()).toEqual(listed);
    expect(new Set(CHANNELS).size).toBe(CHANNELS.length);
  });

  it('the bridge has one named method per channel, frozen, and forwards the channel name', async () => {
    const seen: string[] = [];
    const bridge = buildBridge(async (channel, request) => {
      seen.push(`${channel}:${JSON.stringify(request)}`);
      return null;
    });
    expect(Object.keys(bridge).sort()).toEqual([...CHANNELS].sort());
    expect(Object.isFrozen(bridge)).toBe(true);
    await bridge.appInfo({});
    expect(seen).toEqual(['appInfo:{}']);
  });
});
