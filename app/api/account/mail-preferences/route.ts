import { withAccess } from "@/server/http/with-access";
import { MailPreferencesInput } from "@/server/reminders/preferences";
import { loadMailPreferences, saveMailPreferences } from "@/server/reminders/preferences-queries";

/** The signed-in user's own choice of reminder e-mail. */
export const GET = withAccess({ permission: "vessel:read" }, ({ access }) => loadMailPreferences(access));

export const PUT = withAccess({ permission: "vessel:read", body: MailPreferencesInput }, ({ access, body }) =>
  saveMailPreferences(access, body),
);
