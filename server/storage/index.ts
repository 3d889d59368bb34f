export { createLocalStorage } from './local';
export { ObjectNotFoundError, readAll, randomKeyPart, type ObjectStorage } from './storage';
