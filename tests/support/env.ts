// Where the tests find the test database (scripts/ensure.mjs --test made it fresh and seeded it).
import { TEST_DB_NAME, databaseUrl } from '../../scripts/lib.mjs';

export const TEST_DATABASE_URL: string = process.env.TEST_DATABASE_URL ?? databaseUrl(TEST_DB_NAME);
