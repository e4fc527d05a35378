import os from 'node:os';
import path from 'node:path';

/**
 * Folders for the browser host, following the XDG convention on Linux and the usual places
 * elsewhere. PLUMBLINE_USER_DATA and PLUMBLINE_DOCUMENTS override them (tests, portable use).
 */
export function browserHostFolders(env: NodeJS.ProcessEnv = process.env): { userDataDir: string; documentsDir: string } {
  const home = os.homedir();
  const configHome =
    process.platform === 'win32'
      ? (env['APPDATA'] ?? path.join(home, 'AppData', 'Roaming'))
      : process.platform === 'darwin'
        ? path.join(home, 'Library', 'Application Support')
        : (env['XDG_CONFIG_HOME'] ?? path.join(home, '.config'));
  return {
    userDataDir: env['PLUMBLINE_USER_DATA'] ?? path.join(configHome, 'Plumbline'),
    documentsDir: env['PLUMBLINE_DOCUMENTS'] ?? path.join(home, 'Documents'),
  };
}
