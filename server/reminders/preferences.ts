// Which reminder e-mail each role gets, and the contract of the "My e-mail" preferences.
// Pure: shared by the page, the route handler and the tests.
import { z } from "zod";
import type { Role } from "@/server/auth/roles";

export const REMINDER_KINDS = ["due-digest", "missing-readings", "escalation", "fleet-summary"] as const;
export type ReminderKind = (typeof REMINDER_KINDS)[number];

/** What the reminder run sends to each role (server/reminders/selection.ts chooses the same way). */
const KINDS_OF_ROLE: Record<Role, readonly ReminderKind[]> = {
  engineer: ["due-digest", "missing-readings"],
  "chief-engineer": ["due-digest", "missing-readings", "escalation"],
  superintendent: ["missing-readings", "escalation", "fleet-summary"],
  admin: [],
  viewer: [],
};

export function reminderKindsFor(role: Role): readonly ReminderKind[] {
  return KINDS_OF_ROLE[role];
}

/** `{ receive: { "due-digest": false } }`: only the kinds named change. */
export const MailPreferencesInput = z.strictObject({
  receive: z.strictObject(
    {
      "due-digest": z.boolean().optional(),
      "missing-readings": z.boolean().optional(),
      escalation: z.boolean().optional(),
      "fleet-summary": z.boolean().optional(),
    },
    { error: "Only the reminder e-mails can be switched (each true or false); account messages are always sent." },
  ),
});
export type MailPreferencesInput = z.infer<typeof MailPreferencesInput>;

export type MailPreference = { kind: ReminderKind; label: string; effect: string; receive: boolean };

export type MailPreferences = {
  email: string;
  /** The reminder kinds of the user's role, each with whether they get it. */
  kinds: MailPreference[];
  /** Always sent: invitations and password resets. */
  accountKinds: { label: string; effect: string }[];
};
