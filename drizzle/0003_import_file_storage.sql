-- Original import files are stored gzip-compressed already: keep them out of line without
-- compressing them a second time.
ALTER TABLE "import_file" ALTER COLUMN "content" SET STORAGE EXTERNAL;
