import { env } from "@/lib/env";
import { demoPassword, demoUsers, demoWorkspace } from "./lib/demo";

// Printed by npm start once the app answers. Usage: tsx scripts/print-welcome.ts <seeded: 1|0>
const seeded = process.argv[2] === "1";
const lines = [
  "",
  `Bandwright is running at ${env.APP_URL}`,
  "",
  ...(seeded
    ? [
        `Demo workspace: ${demoWorkspace.name} (${env.APP_URL}/w/${demoWorkspace.slug})`,
        ...demoUsers.map((user) => `  ${user.role.padEnd(7)} ${user.email.padEnd(32)} password: ${demoPassword}`),
      ]
    : ["The demo workspace was not seeded (SEED_DEMO=1 seeds it)."]),
  "",
  env.MAIL_SINK_URL ? `E-mails are kept by the local sink; signed in, read yours at ${env.APP_URL}/dev/mail` : "E-mails go to SMTP_URL.",
  "Press Ctrl-C to stop.",
  "",
];
console.log(lines.join("\n"));
