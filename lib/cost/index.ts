export * from './production';
export * from './rates';
export * from './quote';
export * from './csv';
