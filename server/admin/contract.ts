// What the company administrator sends and gets back for vessels and people, shared by the forms
// (react-hook-form + zod) and the route handlers.
import { z } from "zod";
import { ROLES, type Role } from "@/server/auth/roles";
import { imoProblem, normaliseImo } from "@/server/vessels/imo";

/** better-auth's own limits for a password (minPasswordLength in server/auth/auth.ts, and its default maximum). */
export const MIN_PASSWORD = 10;
export const MAX_PASSWORD = 128;

export const VesselName = z
  .string({ message: "Enter the vessel’s name." })
  .trim()
  .min(2, { message: "The vessel name needs at least 2 characters." })
  .max(80, { message: "Keep the vessel name to 80 characters." });

export const ImoNumber = z.string({ message: "Enter the IMO number, e.g. IMO 9074729." }).transform((raw, ctx) => {
  const problem = imoProblem(raw);
  if (problem) {
    const named = /IMO number/.test(problem)
      ? problem
      : `IMO number: ${problem.charAt(0).toLowerCase()}${problem.slice(1)}`;
    ctx.addIssue({ code: "custom", message: named });
    return z.NEVER;
  }
  return normaliseImo(raw);
});

export const VesselCode = z
  .string({ message: "Enter a short vessel code, e.g. AG." })
  .trim()
  .transform((raw) => raw.toUpperCase())
  .pipe(
    z.string().regex(/^[A-Z0-9]{2,6}$/, {
      message: "The vessel code is 2 to 6 letters or digits, e.g. AG; it starts every work-order number.",
    }),
  );

/**
 * The IANA zone name with its usual capitals ("europe/london" → "Europe/London"), or null when the
 * runtime does not know it. A valid alias keeps the spelling typed: ICU would swap
 * "America/Argentina/Buenos_Aires" for its older name, which surprises whoever typed it.
 */
export function canonicalTimeZone(name: string): string | null {
  // Offsets ("+05:00") and abbreviations ("CET") are not what a ship's day is kept in: names only.
  if (!/^(UTC|[A-Za-z]+(\/[A-Za-z0-9_+-]+)+)$/i.test(name)) return null;
  let resolved: string;
  try {
    resolved = new Intl.DateTimeFormat("en", { timeZone: name }).resolvedOptions().timeZone;
  } catch {
    return null;
  }
  if (resolved.toLowerCase() === name.toLowerCase()) return resolved;
  return Intl.supportedValuesOf("timeZone").find((zone) => zone.toLowerCase() === name.toLowerCase()) ?? name;
}

export const TimeZone = z.string({ message: "Enter the ship’s time zone, e.g. Europe/Oslo." }).transform((raw, ctx) => {
  const zone = canonicalTimeZone(raw.trim());
  if (!zone) {
    ctx.addIssue({
      code: "custom",
      message: `Time zone: “${raw.trim()}” is not an IANA time zone; use a name such as Europe/Oslo, Asia/Singapore or UTC.`,
    });
    return z.NEVER;
  }
  return zone;
});

export const VesselInput = z.object({
  name: VesselName,
  imoNumber: ImoNumber,
  code: VesselCode,
  timeZone: TimeZone,
});
export type VesselInput = z.input<typeof VesselInput>;
export type VesselValues = z.output<typeof VesselInput>;

export const VesselPatch = VesselInput.partial().extend({
  /** `false` returns a retired vessel to service; retiring goes through DELETE. */
  retired: z
    .literal(false, { message: "A vessel is retired with DELETE; send retired: false to return it to service." })
    .optional(),
});
export type VesselPatch = z.input<typeof VesselPatch>;
export type VesselChanges = z.output<typeof VesselPatch>;

export const PersonName = z
  .string({ message: "Enter the person’s name." })
  .trim()
  .min(2, { message: "The name needs at least 2 characters." })
  .max(80, { message: "Keep the name to 80 characters." });

export const Email = z
  .string({ message: "Enter the e-mail address." })
  .trim()
  .toLowerCase()
  .pipe(z.email({ message: "The e-mail address does not look right, e.g. name@company.com." }));

export const MemberRole = z.enum(ROLES, {
  message: `Pick a role: ${ROLES.join(", ")}.`,
});

/** A rank is the person’s title on board or ashore ("Second engineer"); empty means none. */
export const Rank = z
  .string({ message: "The rank is text, e.g. Second engineer." })
  .trim()
  .max(60, { message: "Keep the rank to 60 characters." })
  .transform((rank) => rank || null)
  .nullable()
  .optional();

export const VesselIds = z
  .array(z.uuid({ message: "Vessel assignments: this is not a vessel id." }), {
    message: "Vessel assignments are a list of vessel ids.",
  })
  .max(200, { message: "Vessel assignments: at most 200 vessels." });

export const Password = z
  .string({ message: "Enter a password." })
  .min(MIN_PASSWORD, { message: `The password needs at least ${MIN_PASSWORD} characters.` })
  .max(MAX_PASSWORD, { message: `Keep the password to ${MAX_PASSWORD} characters.` });

export const UserInput = z
  .object({
    name: PersonName,
    email: Email,
    role: MemberRole,
    rank: Rank,
    vesselIds: VesselIds.default([]),
    /** Send an invitation by e-mail: the person chooses their own password through the link. */
    invite: z.boolean({ message: "Invite is true or false." }).default(false),
    initialPassword: Password.optional(),
  })
  .superRefine((v, ctx) => {
    if (!v.invite && v.initialPassword === undefined)
      ctx.addIssue({
        code: "custom",
        path: ["initialPassword"],
        message: "Give a first password, or send an invitation by e-mail instead.",
      });
  });
export type UserInput = z.input<typeof UserInput>;
export type UserValues = z.output<typeof UserInput>;

export const UserPatch = z.object({
  name: PersonName.optional(),
  role: MemberRole.optional(),
  rank: Rank,
  vesselIds: VesselIds.optional(),
  disabled: z.boolean({ message: "Disabled is true or false." }).optional(),
  newPassword: Password.optional(),
});
export type UserPatch = z.input<typeof UserPatch>;
export type UserChanges = z.output<typeof UserPatch>;

export type AdminVessel = {
  id: string;
  name: string;
  code: string;
  imoNumber: string;
  timeZone: string;
  counters: number;
  assignedPeople: number;
  retiredAt: string | null;
};

export type AdminVesselList = { vessels: AdminVessel[] };

export type AdminPerson = {
  id: string;
  name: string;
  email: string;
  role: Role;
  rank: string | null;
  vessels: { id: string; name: string; code: string }[];
  disabled: boolean;
  /** When an invitation was sent that the person has not yet answered by choosing a password. */
  invitedAt: string | null;
  /** When their newest open session began; sessions end at sign-out, so this can be empty. */
  lastSignInAt: string | null;
  isYou: boolean;
};

export type AdminPeopleList = { people: AdminPerson[] };
