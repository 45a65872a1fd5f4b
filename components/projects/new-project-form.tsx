"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Card, Notice } from "@/components/ui/card";
import { Field, Input, Textarea } from "@/components/ui/field";
import { ApiError, apiFetch } from "@/lib/client/api";
import { defaultProjectSettings, labelPalette } from "@/lib/projects/settings";
import { type ClassDraft, LabelSetEditor } from "./label-set-editor";
import { type SettingsDraft, SettingsFields } from "./settings-fields";

export function NewProjectForm() {
  const router = useRouter();
  const [name, setName] = useState("");
  const [description, setDescription] = useState("");
  const [classes, setClasses] = useState<ClassDraft[]>([
    { name: "", colour: labelPalette[0].value },
    { name: "", colour: labelPalette[1].value },
  ]);
  const [settings, setSettings] = useState<SettingsDraft>(defaultProjectSettings);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    setError(null);
    setErrors({});
    try {
      const res = await apiFetch<{ data: { id: number } }>("/api/v1/projects", { body: { name, description, classes, settings } });
      router.push(`/projects/${res.data.id}`);
    } catch (err) {
      if (err instanceof ApiError) {
        setError(err.message);
        setErrors(Object.fromEntries(err.fields.map((f) => [f.path, f.message])));
      } else setError("The project could not be created. Check your connection.");
      setPending(false);
    }
  }

  return (
    <form onSubmit={submit} className="space-y-6" noValidate>
      {error ? <Notice tone="error">{error}</Notice> : null}
      <Card title="Project">
        <div className="space-y-4">
          <Field label="Name" htmlFor="name" error={errors.name}>
            <Input id="name" value={name} onChange={(e) => setName(e.target.value)} invalid={Boolean(errors.name)} />
          </Field>
          <Field label="Description" htmlFor="description" error={errors.description} hint="What the items are and what the labels mean. Annotators see it.">
            <Textarea id="description" rows={3} value={description} onChange={(e) => setDescription(e.target.value)} />
          </Field>
          <LabelSetEditor value={classes} onChange={setClasses} errors={errors} />
        </div>
      </Card>
      <Card title="Labelling and suggestions">
        <SettingsFields value={settings} onChange={setSettings} errors={errors} />
      </Card>
      <div className="flex justify-end">
        <Button type="submit" disabled={pending}>
          {pending ? "Creating…" : "Create project"}
        </Button>
      </div>
    </form>
  );
}
