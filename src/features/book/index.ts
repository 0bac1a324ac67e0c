/** The Book feature: positions revalued under every scenario of a set, with the gap ladder. */
export { BookPage } from './components/BookPage';
