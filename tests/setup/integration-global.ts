/**
 * Integration tests run against a real PostgreSQL: a database created fresh for this run from
 * the migrated template (scripts/test.sh makes the template; run the suite through `npm test`).
 */
import { Client } from "pg";

export default async function setup() {
  const admin = process.env.ADMIN_DATABASE_URL;
  const template = process.env.TEMPLATE_DB;
  if (!admin || !template) {
    throw new Error("Integration tests need ADMIN_DATABASE_URL and TEMPLATE_DB: run them with `npm test`.");
  }
  const name = `rimeplan_t_int_${Date.now()}_${process.pid}`;
  const c = new Client({ connectionString: admin });
  await c.connect();
  await c.query(`create database ${name} template ${template}`);
  await c.end();
  const url = new URL(admin);
  url.pathname = `/${name}`;
  process.env.DATABASE_URL = url.toString();
  process.env.INTEGRATION_DB = name;
  return async () => {
    const d = new Client({ connectionString: admin });
    await d.connect();
    await d.query(`drop database if exists ${name} with (force)`);
    await d.end();
  };
}
