/**
 * Integration tests run against a real PostgreSQL: a database created fresh for this run from
 * the migrated template (scripts/test.sh makes the template; run the suite through `npm test`).
 * It is created with the superuser (ADMIN_DATABASE_URL) and owned by the app's role
 * (APP_DATABASE_URL), which the tests connect as, like the app.
 */
import { Client } from "pg";

export default async function setup() {
  const admin = process.env.ADMIN_DATABASE_URL;
  const template = process.env.TEMPLATE_DB;
  if (!admin || !template) {
    throw new Error("Integration tests need ADMIN_DATABASE_URL and TEMPLATE_DB: run them with `npm test`.");
  }
  const app = new URL(process.env.APP_DATABASE_URL ?? admin);
  const name = `rimeplan_t_int_${Date.now()}_${process.pid}`;
  const c = new Client({ connectionString: admin });
  await c.connect();
  await c.query(`create database ${name} template ${template} owner "${decodeURIComponent(app.username)}"`);
  await c.end();
  app.pathname = `/${name}`;
  process.env.DATABASE_URL = app.toString();
  process.env.INTEGRATION_DB = name;
  return async () => {
    const d = new Client({ connectionString: admin });
    await d.connect();
    await d.query(`drop database if exists ${name} with (force)`);
    await d.end();
  };
}
