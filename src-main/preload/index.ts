// The sandboxed preload (CommonJS). It imports only 'electron' and the dependency-free channel
// list, and exposes one named method per channel of the contract: never a generic invoke.
import { contextBridge, ipcRenderer } from 'electron';
import { buildBridge } from '@shared/model/channels';

contextBridge.exposeInMainWorld(
  'api',
  buildBridge((channel, request) => ipcRenderer.invoke(channel, request)),
);
