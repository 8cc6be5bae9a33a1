// Drops the throwaway databases the PostgreSQL test suite made (wavesieve_test_*), on the server
// of WAVESIEVE_TEST_POSTGRES. Run after the suite; safe to run any time no suite is running.
import pg from "pg";

const url = process.env.WAVESIEVE_TEST_POSTGRES;
if (!url) process.exit(0);
const client = new pg.Client({ connectionString: url });
await client.connect();
const { rows } = await client.query("SELECT datname FROM pg_database WHERE datname LIKE 'wavesieve\\_test\\_%'");
for (const { datname } of rows) await client.query(`DROP DATABASE IF EXISTS "${datname}" WITH (FORCE)`);
await client.end();
console.log(`postgres: dropped ${rows.length} test database(s)`);
