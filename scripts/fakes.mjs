// Local stand-ins for hosted services, started beside the app on loopback.
// Later parts of the product add their fakes here (mail, object storage).
export async function startFakes(_env) {
  return { env: {}, stop: async () => {} };
}
