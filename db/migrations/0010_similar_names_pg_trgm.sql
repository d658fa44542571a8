-- Similar-name warnings before a customer, site or system is created (db/queries/similar-names.ts):
-- trigram similarity from PostgreSQL's pg_trgm extension (shipped in Debian's postgresql-15 package).
CREATE EXTENSION IF NOT EXISTS pg_trgm;
