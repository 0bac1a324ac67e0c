/** `/account`: the signed-in user's account. */
import { AccountPage } from '../features/account';

export default function AccountRoute() {
  return <AccountPage />;
}
