"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { Controller, useForm, useWatch } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import type { AdminPerson, AdminVessel } from "@/server/admin/contract";
import { ROLE_LABEL, ROLES, seesWholeFleet } from "@/server/auth/roles";
import { PasswordField } from "./password-field";
import {
  EditPersonForm,
  NewPersonForm,
  PERSON_FIELDS,
  type PersonFormInput,
  type PersonFormValues,
} from "./person-form-schema";
import { useCreatePerson, useUpdatePerson } from "./use-admin";

type Props = { person?: AdminPerson; vessels: AdminVessel[]; onDone: (message: string) => void };

export function PersonForm({ person, vessels, onDone }: Props) {
  const create = useCreatePerson();
  const update = useUpdatePerson();
  const form = useForm<PersonFormInput, unknown, PersonFormValues>({
    resolver: zodResolver(person ? EditPersonForm : NewPersonForm),
    defaultValues: {
      name: person?.name ?? "",
      email: person?.email ?? "",
      role: person?.role ?? "engineer",
      rank: person?.rank ?? "",
      vesselIds: person?.vessels.map((v) => v.id) ?? [],
      access: "invite",
      initialPassword: "",
    },
  });
  const { register, formState, setValue, control } = form;
  const { errors, isSubmitting } = formState;
  const role = useWatch({ control, name: "role" });
  const access = useWatch({ control, name: "access" });
  // Retired vessels are offered only where the person is still assigned to one.
  const offered = vessels.filter((v) => !v.retiredAt || person?.vessels.some((pv) => pv.id === v.id));

  const { onSubmit, problem } = useSendForm(form, {
    fields: PERSON_FIELDS,
    send: async ({ initialPassword, email, access, ...values }) => {
      if (person) {
        const saved = await update.mutateAsync({ id: person.id, changes: values });
        onDone(`${saved.name} saved.`);
      } else {
        const invite = access === "invite";
        const saved = await create.mutateAsync(
          invite ? { ...values, email, invite } : { ...values, email, initialPassword },
        );
        onDone(
          invite
            ? `${saved.name} added; an invitation is on its way to ${saved.email}. The link works for a week.`
            : `${saved.name} added. Hand over the initial password in person or by phone, never in the same e-mail as the address.`,
        );
      }
    },
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <Field id="person-name" label="Name" error={errors.name?.message}>
        <input
          className="field"
          autoComplete="off"
          {...describedBy("person-name", errors.name?.message)}
          {...register("name")}
        />
      </Field>
      {person ? (
        <div>
          <p className="label">E-mail</p>
          <p className="py-1.5">{person.email}</p>
        </div>
      ) : (
        <Field id="person-email" label="E-mail" error={errors.email?.message} hint="They sign in with this address.">
          <input
            type="email"
            className="field"
            autoComplete="off"
            {...describedBy("person-email", errors.email?.message, true)}
            {...register("email")}
          />
        </Field>
      )}
      <div className="grid grid-cols-2 gap-3">
        <Field id="person-role" label="Role" error={errors.role?.message}>
          <select className="field" {...describedBy("person-role", errors.role?.message)} {...register("role")}>
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABEL[r]}
              </option>
            ))}
          </select>
        </Field>
        <Field id="person-rank" label="Rank (optional)" error={errors.rank?.message} hint="e.g. Second engineer">
          <input
            className="field"
            autoComplete="off"
            {...describedBy("person-rank", errors.rank?.message, true)}
            {...register("rank")}
          />
        </Field>
      </div>

      <fieldset aria-describedby="person-vessels-message">
        <legend className="label">Vessels</legend>
        <p
          id="person-vessels-message"
          className={errors.vesselIds ? "field-error mt-0 mb-1.5" : "mb-1.5 text-xs text-ink-500 dark:text-ink-400"}
        >
          {errors.vesselIds?.message ??
            (seesWholeFleet(role)
              ? `A ${ROLE_LABEL[role].toLowerCase()} sees every vessel; ticks here are kept for later.`
              : "They see only the vessels ticked here.")}
        </p>
        <Controller
          control={control}
          name="vesselIds"
          render={({ field }) => (
            <ul className="grid max-h-56 gap-0.5 overflow-y-auto rounded-md border border-ink-200 p-2 dark:border-ink-800">
              {offered.length === 0 && <li className="text-ink-500">No vessels yet.</li>}
              {offered.map((v) => (
                <li key={v.id}>
                  <label className="flex items-center gap-2 rounded px-1 py-0.5 hover:bg-ink-50 dark:hover:bg-ink-850">
                    <input
                      type="checkbox"
                      className="accent-tide-600"
                      checked={field.value.includes(v.id)}
                      onChange={(e) =>
                        field.onChange(
                          e.target.checked ? [...field.value, v.id] : field.value.filter((id) => id !== v.id),
                        )
                      }
                    />
                    <span className="font-medium">{v.name}</span>
                    <span className="font-mono text-xs text-ink-500">{v.code}</span>
                    {v.retiredAt && <span className="text-xs text-ink-500">retired</span>}
                  </label>
                </li>
              ))}
            </ul>
          )}
        />
      </fieldset>

      {!person && (
        <fieldset>
          <legend className="label">How they get in</legend>
          <label className="flex items-start gap-2 py-0.5">
            <input type="radio" value="invite" className="mt-1 accent-tide-600" {...register("access")} />
            <span>
              Send an invitation by e-mail
              <span className="block text-xs text-ink-500 dark:text-ink-400">
                They choose their own password through a link that works for a week.
              </span>
            </span>
          </label>
          <label className="flex items-start gap-2 py-0.5">
            <input type="radio" value="password" className="mt-1 accent-tide-600" {...register("access")} />
            <span>
              Set a first password now
              <span className="block text-xs text-ink-500 dark:text-ink-400">
                For someone without e-mail on board yet; hand it over in person.
              </span>
            </span>
          </label>
        </fieldset>
      )}

      {!person && access === "password" && (
        <PasswordField
          id="person-initialPassword"
          label="Initial password"
          error={errors.initialPassword?.message}
          registration={register("initialPassword")}
          onSuggest={(password) => setValue("initialPassword", password, { shouldValidate: true })}
        />
      )}

      <FormActions
        submitLabel={person ? "Save" : access === "invite" ? "Add and invite" : "Add person"}
        busy={isSubmitting}
        problem={problem}
      />
    </form>
  );
}
