// Creates the database named in DATABASE_URL when it does not exist yet
// (`--fresh` drops and recreates it, for the test run).
import { Client } from "pg";

const url = new URL(process.env.DATABASE_URL ?? "");
const name = url.pathname.slice(1);
if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`unexpected database name "${name}"`);
const admin = new URL(url);
admin.pathname = "/postgres";
const client = new Client({ connectionString: admin.toString() });
await client.connect();
if (process.argv.includes("--fresh")) await client.query(`drop database if exists ${name} with (force)`);
const { rowCount } = await client.query("select 1 from pg_database where datname = $1", [name]);
if (!rowCount) await client.query(`create database ${name}`);
await client.end();
