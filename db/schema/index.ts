export * from './auth';
export * from './studios';
export * from './setups';
export * from './crew';
export * from './classes';
export * from './limits';
export * from './operators';
