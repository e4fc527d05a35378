import { Menu, dialog, type BrowserWindow, type MenuItemConstructorOptions } from 'electron';
import { CAUTIONS } from '@shared/text/cautions';
import type { MenuCommand } from '@shared/model/channels';
import { APP_NAME, APP_VERSION } from '../app-meta';

export function buildMenu(getWindow: () => BrowserWindow | null, send: (command: MenuCommand) => void): Menu {
  const item = (label: string, command: MenuCommand, accelerator?: string): MenuItemConstructorOptions => ({
    label,
    ...(accelerator === undefined ? {} : { accelerator }),
    click: () => send(command),
  });
  const template: MenuItemConstructorOptions[] = [
    {
      label: 'File',
      submenu: [
        item('New plan', 'new', 'CmdOrCtrl+N'),
        item('New from the demo', 'new-demo'),
        item('Open…', 'open', 'CmdOrCtrl+O'),
        { type: 'separator' },
        item('Save', 'save', 'CmdOrCtrl+S'),
        item('Save as…', 'save-as', 'CmdOrCtrl+Shift+S'),
        item('Revert to saved', 'revert'),
        { type: 'separator' },
        { role: 'quit' },
      ],
    },
    {
      label: 'Edit',
      submenu: [
        item('Undo', 'undo', 'CmdOrCtrl+Z'),
        item('Redo', 'redo', 'CmdOrCtrl+Shift+Z'),
        { type: 'separator' },
        { role: 'cut' },
        { role: 'copy' },
        { role: 'paste' },
        { role: 'selectAll' },
      ],
    },
    {
      label: 'View',
      submenu: [
        { role: 'resetZoom' },
        { role: 'zoomIn' },
        { role: 'zoomOut' },
        { type: 'separator' },
        { role: 'togglefullscreen' },
      ],
    },
    {
      label: 'Help',
      submenu: [
        {
          label: `About ${APP_NAME}`,
          click: () => {
            const window = getWindow();
            const options = {
              type: 'info' as const,
              title: `About ${APP_NAME}`,
              message: `${APP_NAME} ${APP_VERSION}`,
              detail: `Sample sizes for the external validation of clinical prediction models across sites.\n\n${CAUTIONS.join('\n\n')}`,
            };
            void (window ? dialog.showMessageBox(window, options) : dialog.showMessageBox(options));
          },
        },
      ],
    },
  ];
  return Menu.buildFromTemplate(template);
}
