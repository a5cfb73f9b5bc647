// What each kind of message is called where people choose what they get (preferences, the
// unsubscribe page, the admin's outbox). Pure: safe in client components.
import type { MailKind } from "./outbox";

export const MAIL_KIND_LABEL: Record<MailKind, string> = {
  "due-digest": "daily due digest",
  "missing-readings": "missing-readings reminders",
  escalation: "out-of-tolerance escalations",
  "fleet-summary": "weekly fleet summary",
  invitation: "invitations",
  "password-reset": "password resets",
};

/** What a person stops getting when they unsubscribe from the kind (the unsubscribe page). */
export const MAIL_KIND_EFFECT: Record<MailKind, string> = {
  "due-digest":
    "the morning list of work that opened, ran late or went out of tolerance on your vessels, with what falls due in the next 7 days",
  "missing-readings": "the reminder sent when a vessel has entered no hour-meter reading for a while",
  escalation: "the message sent when a work order goes out of tolerance",
  "fleet-summary": "the weekly summary of the fleet’s due and overdue work",
  invitation: "invitations to join a company in Keelson",
  "password-reset": "links to set a new password",
};
