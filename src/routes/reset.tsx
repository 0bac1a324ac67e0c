/** `/reset`: set a new password from a reset link. */
import { ResetPage } from '../features/account';

export default function ResetRoute() {
  return <ResetPage />;
}
