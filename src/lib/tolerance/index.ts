export * from './decimal';
