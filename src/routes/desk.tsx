import { PagePlaceholder } from '../components/PagePlaceholder';

export function DeskPage() {
  return (
    <PagePlaceholder title="Desk">
      <p>
        Sign in to the sync service to share scenario sets with your desk: members and their roles
        (lead, trader, analyst), e-mail invites, and who changed what in each scenario&apos;s
        revision history.
      </p>
    </PagePlaceholder>
  );
}
