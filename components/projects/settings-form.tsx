"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field, Input, Textarea } from "@/components/ui/field";
import { apiFetch } from "@/lib/client/api";
import type { ProjectSettings } from "@/lib/projects/settings";
import { ProjectForm } from "./project-form";
import type { SettingsDraft } from "./settings-fields";
import { useProjectSubmit } from "./use-project-submit";

export function SettingsForm({ projectId, initial }: { projectId: number; initial: { name: string; description: string; settings: ProjectSettings } }) {
  const router = useRouter();
  const [name, setName] = useState(initial.name);
  const [description, setDescription] = useState(initial.description);
  const [settings, setSettings] = useState<SettingsDraft>(initial.settings);
  const { errors, notice, pending, submit } = useProjectSubmit("Saving failed. Check your connection.");

  async function save() {
    await apiFetch(`/api/v1/projects/${projectId}`, { method: "PATCH", body: { name, description, settings } });
    router.refresh();
    return { notice: "Settings saved. Suggestion changes apply to the next item shown." };
  }

  return (
    <ProjectForm onSubmit={submit(save)} notice={notice} settings={settings} onSettingsChange={setSettings} errors={errors} pending={pending} submitLabel="Save settings" pendingLabel="Saving…">
      <Field label="Name" htmlFor="name" error={errors.name}>
        <Input id="name" value={name} onChange={(e) => setName(e.target.value)} />
      </Field>
      <Field label="Description" htmlFor="description" error={errors.description}>
        <Textarea id="description" rows={3} value={description} onChange={(e) => setDescription(e.target.value)} />
      </Field>
    </ProjectForm>
  );
}
