import nodemailer from "nodemailer";
import { env } from "@/lib/env";

export const transport = nodemailer.createTransport({
  host: env.SMTP_HOST,
  port: env.SMTP_PORT,
  secure: env.SMTP_SECURE,
  auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? "" } : undefined,
  ignoreTLS: !env.SMTP_SECURE && env.SMTP_HOST === "127.0.0.1",
  connectionTimeout: 5_000,
});

export type Mail = { to: string; subject: string; text: string; html?: string };

export async function sendMail(mail: Mail) {
  await transport.sendMail({ from: env.MAIL_FROM, ...mail });
}

export async function mailHealthy(): Promise<boolean> {
  try {
    await transport.verify();
    return true;
  } catch {
    return false;
  }
}
