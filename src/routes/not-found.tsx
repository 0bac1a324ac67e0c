import { Link } from 'react-router';

export function NotFoundPage() {
  return (
    <section className="space-y-3">
      <h1 className="text-2xl font-semibold">No such page</h1>
      <p>
        <Link className="text-teal underline" to="/">
          Back to Sketch
        </Link>
      </p>
    </section>
  );
}
