import { CHANNELS } from '@shared/model/channels';

/**
 * The browser stand-in for the preload: a classic script served by the loopback host before the
 * app's own module. It defines a frozen window.api with one named method per channel, exactly as
 * the preload does with contextBridge, and forwards each call to POST /__ipc/<channel> with the
 * run's token. Answers are the same envelopes ipcMain returns.
 */
export function bridgeScript(token: string): string {
  return `(() => {
  'use strict';
  const channels = ${JSON.stringify(CHANNELS)};
  const token = ${JSON.stringify(token)};
  const api = {};
  for (const channel of channels) {
    api[channel] = async (request) => {
      let response;
      try {
        response = await fetch('/__ipc/' + encodeURIComponent(channel), {
          method: 'POST',
          credentials: 'same-origin',
          headers: { 'content-type': 'application/json', 'x-plumbline-token': token },
          body: JSON.stringify(request === undefined ? {} : request),
        });
      } catch (error) {
        return { ok: false, error: { code: 'transport', message: 'The local Plumbline host did not answer: ' + String(error) } };
      }
      if (!response.ok) {
        return { ok: false, error: { code: 'transport', message: 'The local Plumbline host refused the request (HTTP ' + response.status + ').' } };
      }
      return response.json();
    };
  }
  Object.defineProperty(window, 'api', { value: Object.freeze(api), writable: false, configurable: false, enumerable: true });
})();
`;
}
