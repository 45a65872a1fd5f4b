import { env } from "@/lib/env";

const footer = "\n\n— Vicinal\nYou get this message because someone used this address in Vicinal. If it was not you, you can ignore it.";

export function signInLinkMail(url: string) {
  return {
    subject: "Your Vicinal sign-in link",
    text: `Open this link to sign in to Vicinal. It works once, within 15 minutes:\n\n${url}${footer}`,
  };
}

export function passwordResetMail(url: string) {
  return {
    subject: "Reset your Vicinal password",
    text: `Someone asked to reset the password of this Vicinal account. To choose a new password, open this link within 30 minutes:\n\n${url}\n\nIf you did not ask, your password stays as it is.${footer}`,
  };
}

export function invitationMail(input: { projectName: string; role: string; inviter: string; url: string }) {
  return {
    subject: `You are invited to "${input.projectName}" on Vicinal`,
    text: `${input.inviter} invited you to the Vicinal project "${input.projectName}" as ${input.role}.\n\nAccept the invitation (valid for 7 days):\n${input.url}${footer}`,
  };
}

export function disputeDigestMail(input: { projectName: string; open: number; projectId: number }) {
  return {
    subject: `${input.open} disputes wait in "${input.projectName}"`,
    text: `${input.open} items in "${input.projectName}" wait for a ruling.\n\nOpen Disputes: ${env.APP_URL}/projects/${input.projectId}/disputes${footer}`,
  };
}

export function editionReadyMail(input: { projectName: string; number: number; projectId: number }) {
  return {
    subject: `Edition ${input.number} of "${input.projectName}" is ready`,
    text: `Edition ${input.number} of "${input.projectName}" has been published.\n\nDownload it: ${env.APP_URL}/projects/${input.projectId}/editions${footer}`,
  };
}
