export * from './auth';
export * from './audit';
export * from './cases';
export * from './review';
export * from './mail';
export * from './search';
export * from './attachments';
