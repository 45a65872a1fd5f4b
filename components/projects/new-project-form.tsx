"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field, Input, Textarea } from "@/components/ui/field";
import { apiFetch } from "@/lib/client/api";
import { defaultProjectSettings, labelPalette } from "@/lib/projects/settings";
import { type ClassDraft, LabelSetEditor } from "./label-set-editor";
import { ProjectForm } from "./project-form";
import type { SettingsDraft } from "./settings-fields";
import { useProjectSubmit } from "./use-project-submit";

export function NewProjectForm() {
  const router = useRouter();
  const [name, setName] = useState("");
  const [description, setDescription] = useState("");
  const [classes, setClasses] = useState<ClassDraft[]>([
    { name: "", colour: labelPalette[0].value },
    { name: "", colour: labelPalette[1].value },
  ]);
  const [settings, setSettings] = useState<SettingsDraft>(defaultProjectSettings);
  const { errors, notice, pending, submit } = useProjectSubmit("The project could not be created. Check your connection.");

  async function create() {
    const res = await apiFetch<{ data: { id: number } }>("/api/v1/projects", { body: { name, description, classes, settings } });
    router.push(`/projects/${res.data.id}`);
    return { leaving: true } as const;
  }

  return (
    <ProjectForm onSubmit={submit(create)} notice={notice} settings={settings} onSettingsChange={setSettings} errors={errors} pending={pending} submitLabel="Create project" pendingLabel="Creating…">
      <Field label="Name" htmlFor="name" error={errors.name}>
        <Input id="name" value={name} onChange={(e) => setName(e.target.value)} invalid={Boolean(errors.name)} />
      </Field>
      <Field label="Description" htmlFor="description" error={errors.description} hint="What the items are and what the labels mean. Annotators see it.">
        <Textarea id="description" rows={3} value={description} onChange={(e) => setDescription(e.target.value)} />
      </Field>
      <LabelSetEditor value={classes} onChange={setClasses} errors={errors} />
    </ProjectForm>
  );
}
