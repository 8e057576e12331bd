/// Environment that lib/ops/test.sh exports for the suites; a clear error when a suite that
/// needs it is run on its own.
export function testEnv(
  name: "DATABASE_URL" | "RINGSIDE_TEST_BASE_URL" | "RINGSIDE_MAIL_DIR" | "RINGSIDE_TEST_SERVER_LOG" | "RINGSIDE_DETAIL_DIR",
): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: run this suite through \`npm test\`, which sets up the test database and server.`);
  return value;
}
