-- Server schema version 2: full-text search over reported symptoms and notes with PostgreSQL's
-- own text search: a tsvector kept beside each text (a stored generated column) and a GIN index.
-- The 'simple' configuration lower-cases words without stemming, and unaccent folds accents, as
-- the bench's index does (unicode61, remove_diacritics).

CREATE EXTENSION IF NOT EXISTS unaccent SCHEMA public;

-- unaccent is STABLE (its dictionary could change); naming the dictionary makes the result fixed,
-- which a generated column needs (the usual wrapper, PostgreSQL documentation F.47).
CREATE FUNCTION words_of(body TEXT) RETURNS tsvector
  LANGUAGE sql IMMUTABLE PARALLEL SAFE
  AS 'SELECT pg_catalog.to_tsvector(''pg_catalog.simple''::pg_catalog.regconfig, public.unaccent(''public.unaccent''::pg_catalog.regdictionary, body))';

CREATE FUNCTION query_of(words TEXT) RETURNS tsquery
  LANGUAGE sql IMMUTABLE PARALLEL SAFE
  AS 'SELECT pg_catalog.to_tsquery(''pg_catalog.simple''::pg_catalog.regconfig, public.unaccent(''public.unaccent''::pg_catalog.regdictionary, words))';

ALTER TABLE repair_case ADD COLUMN symptom_words tsvector
  GENERATED ALWAYS AS (words_of(symptom)) STORED;
CREATE INDEX repair_case_words ON repair_case USING gin (symptom_words);

ALTER TABLE case_note ADD COLUMN text_words tsvector
  GENERATED ALWAYS AS (words_of(text)) STORED;
CREATE INDEX case_note_words ON case_note USING gin (text_words);
