export * from './schema';
export * from './parse';
export * from './nets';
export * from './designators';
