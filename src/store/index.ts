export * from './db';
export * from './connection';
export * from './records';
export * from './backup';
export * from './storage';
