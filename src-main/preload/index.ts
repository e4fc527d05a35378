// The sandboxed preload (CommonJS). It imports only 'electron' and the dependency-free channel
// list, and exposes one named method per channel of the contract: never a generic invoke.
import { contextBridge, ipcRenderer } from 'electron';
import { buildBridge, isMenuCommand, MENU_EVENT, type MenuBridge } from '@shared/model/channels';

contextBridge.exposeInMainWorld(
  'api',
  buildBridge((channel, request) => ipcRenderer.invoke(channel, request)),
);

const menu: MenuBridge = {
  onCommand(listener) {
    const handler = (_event: unknown, command: unknown): void => {
      if (isMenuCommand(command)) listener(command);
    };
    ipcRenderer.on(MENU_EVENT, handler);
    return () => {
      ipcRenderer.removeListener(MENU_EVENT, handler);
    };
  },
};
contextBridge.exposeInMainWorld('plumblineMenu', menu);
