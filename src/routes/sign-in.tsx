/** `/signin`: sign in, register or ask for a password reset. */
import { SignInPage } from '../features/account';

export default function SignInRoute() {
  return <SignInPage />;
}
