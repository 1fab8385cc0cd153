// Integration and browser tests write to the database: refuse anything but the throwaway one
// that `npm test` creates, so a stray run can never touch real data.
if (!process.env.LOXODROME_TEST_DATABASE || !process.env.DATABASE_URL?.endsWith(`/${process.env.LOXODROME_TEST_DATABASE}`)) {
  throw new Error("Integration and browser tests run through `npm test`, which creates a throwaway database for them.");
}
