"use client";

import type { ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { Card, Notice } from "@/components/ui/card";
import { type SettingsDraft, SettingsFields } from "./settings-fields";
import type { FormNotice } from "./use-project-submit";

type ProjectFormProps = {
  onSubmit: (e: React.FormEvent) => void;
  notice: FormNotice | null;
  /** The fields of the "Project" card. */
  children: ReactNode;
  settings: SettingsDraft;
  onSettingsChange: (v: SettingsDraft) => void;
  errors: Record<string, string>;
  pending: boolean;
  submitLabel: string;
  pendingLabel: string;
};

/** The frame of the new-project and project-settings forms: notice, Project card, settings card, submit button. */
export function ProjectForm({ onSubmit, notice, children, settings, onSettingsChange, errors, pending, submitLabel, pendingLabel }: ProjectFormProps) {
  return (
    <form onSubmit={onSubmit} className="space-y-6" noValidate>
      {notice ? <Notice tone={notice.tone}>{notice.text}</Notice> : null}
      <Card title="Project">
        <div className="space-y-4">{children}</div>
      </Card>
      <Card title="Labelling and suggestions">
        <SettingsFields value={settings} onChange={onSettingsChange} errors={errors} />
      </Card>
      <div className="flex justify-end">
        <Button type="submit" disabled={pending}>
          {pending ? pendingLabel : submitLabel}
        </Button>
      </div>
    </form>
  );
}
