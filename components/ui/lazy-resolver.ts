import type { FieldValues, Resolver } from "react-hook-form";
import type { z } from "zod";

/**
 * A react-hook-form resolver for a zod schema that loads zod, the zod resolver and the schema
 * the first time the form validates (usually its first submit), not with the page: a screen
 * that shows a form then costs no zod until someone uses it. The schema is the API body's own
 * (the server parses the same one again), so the rules and messages stay the API's. Call it at
 * module level, so the loaded resolver is kept across renders; a failed load is retried on
 * the next validation.
 */
export function lazyZodResolver<In extends FieldValues, Out>(load: () => Promise<z.ZodType<Out, In>>): Resolver<In, unknown, Out> {
  let ready: Promise<Resolver<In, unknown, Out>> | null = null;
  return async (values, context, options) => {
    const pending = (ready ??= Promise.all([load(), import("@hookform/resolvers/zod")]).then(([schema, { zodResolver }]) => zodResolver(schema)));
    let resolve: Resolver<In, unknown, Out>;
    try {
      resolve = await pending;
    } catch (err) {
      if (ready === pending) ready = null;
      throw err;
    }
    return resolve(values, context, options);
  };
}
