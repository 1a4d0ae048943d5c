import { CardSection } from '../../components/ui/card';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { useMe } from '../../features/auth/api/get-me';
import { useTeam } from '../../features/team/api/get-team';
import { InvitationsList } from '../../features/team/components/invitations-list';
import { InviteForm } from '../../features/team/components/invite-form';
import { MembersTable } from '../../features/team/components/members-table';

export function TeamRoute() {
  const me = useMe();
  const team = useTeam();
  return (
    <div className="flex max-w-5xl flex-col gap-8">
      <PageHeader title="Team" description="Who can sign in to this business, and what each person's role lets them do." />
      <CardSection title="Invite someone">
        <InviteForm />
      </CardSection>
      {team.isPending ? (
        <SkeletonRows rows={4} label="Loading the team" />
      ) : team.isError ? (
        <ErrorState error={team.error} onRetry={() => team.refetch()} />
      ) : (
        <>
          <section aria-labelledby="members-heading">
            <h2 id="members-heading" className="mb-3 text-lg font-bold">
              People <span className="font-normal text-muted tabular-nums">({team.data.members.length})</span>
            </h2>
            <MembersTable members={team.data.members} currentUserId={me.data?.user.id ?? ''} />
          </section>
          <section aria-labelledby="invitations-heading">
            <h2 id="invitations-heading" className="mb-3 text-lg font-bold">
              Invitations waiting
            </h2>
            <InvitationsList invitations={team.data.invitations} />
          </section>
        </>
      )}
    </div>
  );
}
