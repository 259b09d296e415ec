export * from './schemas/roles.schema.js';
export * from './schemas/auth.schema.js';
export * from './schemas/group.schema.js';
export * from './schemas/api-error.schema.js';
export * from './schemas/potential-model.schema.js';
export * from './schemas/scan-summary.schema.js';
export * from './schemas/admin.schema.js';
export * from './schemas/paging.schema.js';
