// The person form's schemas: the contract's pieces, one shape for adding and for editing so both
// modes share the fields. Editing does not change the e-mail address or send a password.
import { z } from "zod";
import { Email, MemberRole, Password, PersonName, Rank, VesselIds } from "@/server/admin/contract";
import { suggestPassword } from "@/server/admin/rules";

const shared = { name: PersonName, role: MemberRole, rank: Rank, vesselIds: VesselIds };

export const NewPersonForm = z
  .object({ ...shared, email: Email, access: z.enum(["invite", "password"]), initialPassword: z.string() })
  .superRefine((v, ctx) => {
    if (v.access !== "password") return;
    const checked = Password.safeParse(v.initialPassword);
    if (!checked.success)
      ctx.addIssue({ code: "custom", path: ["initialPassword"], message: checked.error.issues[0]!.message });
  });
export const EditPersonForm = z.object({
  ...shared,
  email: z.string(),
  access: z.enum(["invite", "password"]),
  initialPassword: z.string(),
});
export type PersonFormInput = z.input<typeof NewPersonForm>;
export type PersonFormValues = z.output<typeof NewPersonForm>;

export const PERSON_FIELDS = ["name", "email", "role", "rank", "vesselIds", "initialPassword"] as const;

/** A readable password from the browser's random source, for the administrator to hand over. */
export function randomPassword(): string {
  return suggestPassword((count) => Array.from(crypto.getRandomValues(new Uint32Array(count))));
}
