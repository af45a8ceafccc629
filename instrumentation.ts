export async function register() {
  if (process.env.NEXT_RUNTIME === "nodejs") {
    const { prepareServer } = await import("./lib/server/startup");
    await prepareServer();
  }
}
