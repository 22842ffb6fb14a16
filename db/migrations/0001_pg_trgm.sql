-- Trigram indexes serve the library's search as you type (ILIKE '%word%'); pg_trgm ships with PostgreSQL's contrib.
CREATE EXTENSION IF NOT EXISTS pg_trgm;
