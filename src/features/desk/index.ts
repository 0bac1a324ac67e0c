/** The Desk feature: members, roles, invites and the desk's sets. */
export { DeskPage } from './components/DeskPage';
