"use client";

import { useState } from "react";
import { Field, FormMessage } from "@/components/ui/field";
import { messageAfterRefusal, useSchemaForm } from "@/components/ui/use-schema-form";
import { fetchJson } from "@/lib/client/fetch-json";
import { projectCreateSchema } from "@/lib/schemas/projects";

export function ProjectCreateForm({ onCreated }: { onCreated: () => void }) {
  const [formError, setFormError] = useState<string>();
  const form = useSchemaForm(projectCreateSchema, { defaultValues: { name: "", description: "" } });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(undefined);
    try {
      await fetchJson("/api/projects", { method: "POST", json: values });
      form.reset();
      onCreated();
    } catch (err) {
      setFormError(messageAfterRefusal(err, form.setError, ["name", "description"]));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="card grid gap-3 p-4 md:grid-cols-[1fr_2fr_auto] md:items-start" aria-label="New project">
      <Field id="project-name" label="New project" error={errors.name?.message}>
        <input id="project-name" className="input" placeholder="e.g. Ester line 3 revamp" aria-invalid={!!errors.name} {...form.register("name")} />
      </Field>
      <Field id="project-description" label="Purpose" error={errors.description?.message}>
        <input id="project-description" className="input" placeholder="What the train must achieve" {...form.register("description")} />
      </Field>
      <div className="md:pt-5">
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          Create project
        </button>
      </div>
      {formError ? (
        <div className="md:col-span-3">
          <FormMessage kind="error">{formError}</FormMessage>
        </div>
      ) : null}
    </form>
  );
}
