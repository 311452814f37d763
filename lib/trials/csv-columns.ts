/** The measurement CSV columns, shared by the importer and the help text on screen. Pure data. */
export const COOK_CSV_COLUMN_NAMES = [
  'variant', 'cook_date', 'batch_size_g', 'brix_reading', 'brix_sample_temp_c', 'ph', 'end_point_c', 'boil_time_min',
  'set_test_score', 'set_test_method', 'syneresis', 'colour_notes', 'yield_jars', 'yield_g', 'notes',
] as const;

export const COOK_CSV_HEADER = COOK_CSV_COLUMN_NAMES.join(',');
