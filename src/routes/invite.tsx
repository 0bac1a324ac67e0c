/** `/invite`: join a desk from an invite link. */
import { InvitePage } from '../features/account';

export default function InviteRoute() {
  return <InvitePage />;
}
