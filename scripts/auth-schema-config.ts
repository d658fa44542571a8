// Used only by `npx auth@1.6.33 generate` to write db/schema/auth.ts; see DEVELOPERS.md.
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins";

export const auth = betterAuth({
  database: drizzleAdapter({} as never, { provider: "pg" }),
  emailAndPassword: { enabled: true },
  rateLimit: { storage: "database" },
  plugins: [organization()],
});
