// Co-editing of one sheet: operations, their pure apply and diff, the protocol and the client.
export * from './ops';
export * from './apply';
export * from './diff';
export * from './normalize';
export * from './reconcile';
export * from './protocol';
export * from './transport';
export * from './presence';
export * from './client';
export * from './replay-step';
