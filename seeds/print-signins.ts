import { DEMO_PASSWORD, DEMO_USERS } from "./demo";

const url = process.argv[2] ?? "http://localhost:3000";
console.log(`\n  Rimeplan is running at ${url}\n`);
console.log("  Demo sign-ins (invented workspace \"Harrowfield Cold Store\"), password for all: " + DEMO_PASSWORD);
for (const u of DEMO_USERS) console.log(`    ${u.role.padEnd(11)} ${u.email}`);
console.log(`\n  Caught e-mail (invites, sign-in links, password resets): ${url}/dev/mail\n`);
