-- No double booking, enforced by the database: two loans of one kit may not share a day while
-- both hold the kit (requested, approved, shipped, in use). Dates are inclusive. Needs btree_gist
-- (created at start-up, src/db/client.ts) for the equality on kit_id inside a GiST index.
ALTER TABLE "loan" ADD CONSTRAINT "loan_no_double_booking" EXCLUDE USING gist (
  "kit_id" WITH =,
  daterange("start_date", "end_date", '[]') WITH &&
) WHERE ("status" IN ('requested', 'approved', 'shipped', 'in-use'));
