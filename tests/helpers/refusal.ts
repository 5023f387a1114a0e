import { AppError } from "@/lib/errors";

/** The AppError a promise is refused with; fails the test when it resolves or throws anything else. */
export async function refusal(p: Promise<unknown>): Promise<AppError> {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  if (!(err instanceof AppError)) throw new Error(`expected a refusal, got ${String(err)}`);
  return err;
}
