export { createTestDatabase, type TestDatabase } from './db.js';
