import { Link } from "react-router";

export function Component() {
  return (
    <div className="max-w-lg">
      <h1 className="text-2xl font-semibold">Nothing here</h1>
      <p className="mt-2 text-graphite">This address does not match a page in Reversa.</p>
      <Link to="/objects" className="mt-4 inline-block font-medium text-accent underline">
        Go to the register
      </Link>
    </div>
  );
}
