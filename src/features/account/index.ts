/** The account feature: sign-in, the account page, password reset and invite links. */
export { AccountPage } from './components/AccountPage';
export { SignInPage } from './components/SignInPage';
export { InvitePage, ResetPage } from './components/TokenPages';
