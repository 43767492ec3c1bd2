-- The elements are found with ILIKE over a few hundred rows: the text-search index 0016 made was never used.
DROP INDEX "standard_elements_search_idx";