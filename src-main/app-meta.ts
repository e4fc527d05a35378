import packageJson from '../package.json';

export const APP_NAME = 'Plumbline';
export const APP_VERSION: string = packageJson.version;
