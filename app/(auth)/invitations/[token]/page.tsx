import Link from "next/link";
import { auth } from "@/auth";
import { AcceptInviteForm } from "@/components/auth/accept-invite-form";
import { Notice } from "@/components/ui/card";
import { getInvitationBySecret } from "@/db/queries/members";

export const metadata = { title: "Invitation" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const found = token.length < 200 ? await getInvitationBySecret({ secret: token }) : null;
  const session = await auth();
  if (!found) {
    return <Notice tone="error" title="This invitation does not exist">Check the link in your e-mail, or ask the project owner to invite you again.</Notice>;
  }
  const { invitation, projectName, usable, accountExists } = found;
  if (!usable) {
    return (
      <Notice tone="caution" title="This invitation can no longer be used">
        {invitation.acceptedAt ? (
          <>
            It was already accepted. <Link className="font-semibold underline" href="/sign-in">Sign in</Link> to open the project.
          </>
        ) : (
          "It has expired or was withdrawn. Ask the project owner for a new one."
        )}
      </Notice>
    );
  }
  const signedInAs = session?.user?.email ?? null;
  const needsAccount = !accountExists;
  return (
    <div className="space-y-6">
      <div>
        <p className="text-xs font-bold uppercase tracking-[0.12em] text-amber-700">Invitation</p>
        <h1 className="mt-1 text-2xl font-extrabold tracking-tight">Join “{projectName}”</h1>
        <p className="mt-1 text-sm text-ink-soft">
          You are invited as <strong className="text-ink">{invitation.role}</strong> for {invitation.email}.
        </p>
      </div>
      {signedInAs && signedInAs !== invitation.email ? (
        <Notice tone="caution">You are signed in as {signedInAs}. This invitation is for {invitation.email}: sign out first, then open the link again.</Notice>
      ) : accountExists && !signedInAs ? (
        <>
          <p className="text-sm text-ink-soft">You already have an account. Accept, then sign in to open the project.</p>
          <AcceptInviteForm token={token} needsAccount={false} email={invitation.email} />
        </>
      ) : (
        <AcceptInviteForm token={token} needsAccount={needsAccount} email={invitation.email} />
      )}
    </div>
  );
}
