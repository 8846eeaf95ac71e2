import { isRouteErrorResponse, Link, useRouteError } from "react-router";

export function RouteError() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : "Unknown error";
  return (
    <div className="mx-auto max-w-lg p-10">
      <h1 className="text-xl font-semibold">This page could not be shown</h1>
      <p className="mt-2 text-graphite">{message}</p>
      <p className="mt-4">
        <Link to="/" className="font-medium text-accent underline">
          Back to Reversa
        </Link>
      </p>
    </div>
  );
}
