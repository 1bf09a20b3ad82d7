-- Plumbline arm totals for plan basket-shapes, data through 2026-11-19 (UTC), dialect postgres.
-- Columns: grain, arm, bucket, metric, units, n, sum_y, sum_y2, sum_x, sum_x2, sum_xy, sum_pre, sum_pre2, sum_ypre. Save the result as CSV with a header and run: plumbline totals basket-shapes --from-rows <file.csv> --through 2026-11-19
WITH
exposure_rows AS (
  SELECT CAST("user_id" AS TEXT) AS unit_id, CAST("variant" AS TEXT) AS arm, CAST("exposed_at" AS TIMESTAMPTZ) AS exposed_at, CAST("platform" AS TEXT) AS segment_1, CAST("country" AS TEXT) AS segment_2
  FROM "analytics"."exposures"
  WHERE "user_id" IS NOT NULL
    AND (CAST("exposed_at" AS TIMESTAMPTZ) IS NULL
      OR (CAST("exposed_at" AS TIMESTAMPTZ) >= CAST('2026-11-09 00:00:00+00' AS TIMESTAMPTZ)
        AND CAST("exposed_at" AS TIMESTAMPTZ) < CAST('2026-11-20 00:00:00+00' AS TIMESTAMPTZ)))
    AND CAST("experiment" AS TEXT) = 'basket-shapes'
),
known_rows AS (
  SELECT *
  FROM exposure_rows
  WHERE exposed_at IS NOT NULL
    AND arm IN ('control', 'shortcut')
),
first_exposures AS (
  SELECT unit_id, MIN(exposed_at) AS first_exposed, MIN(arm) AS arm, MAX(arm) AS last_arm
  FROM known_rows
  GROUP BY unit_id
),
first_segments AS (
  SELECT k.unit_id, MIN(k.segment_1) AS segment_1, MIN(k.segment_2) AS segment_2
  FROM known_rows k
  JOIN first_exposures f ON f.unit_id = k.unit_id AND f.first_exposed = k.exposed_at
  GROUP BY k.unit_id
),
units AS (
  SELECT f.unit_id, f.arm, f.first_exposed, TO_CHAR(f.first_exposed AT TIME ZONE 'UTC', 'YYYY-MM-DD') AS exposure_day, COALESCE(s.segment_1, '(missing)') AS segment_1, COALESCE(s.segment_2, '(missing)') AS segment_2
  FROM first_exposures f
  LEFT JOIN first_segments s ON s.unit_id = f.unit_id
  WHERE f.arm = f.last_arm
),
event_rows AS (
  SELECT CAST("user_id" AS TEXT) AS unit_id, CAST("event_name" AS TEXT) AS event, CAST("occurred_at" AS TIMESTAMPTZ) AS occurred_at, CAST("amount" AS NUMERIC(38, 6)) AS value
  FROM "analytics"."events"
  WHERE "user_id" IS NOT NULL
    AND CAST("event_name" AS TEXT) IN ('order_placed', 'basket_viewed')
    AND CAST("occurred_at" AS TIMESTAMPTZ) >= (CAST('2026-11-09 00:00:00+00' AS TIMESTAMPTZ) - INTERVAL '336 hours')
    AND CAST("occurred_at" AS TIMESTAMPTZ) < CAST('2026-11-20 00:00:00+00' AS TIMESTAMPTZ)
),
unit_events AS (
  SELECT u.unit_id,
    SUM(CASE WHEN e.event IN ('order_placed') AND e.occurred_at >= u.first_exposed THEN 1 ELSE 0 END) AS m0_y,
    SUM(CASE WHEN e.event IN ('order_placed') AND e.occurred_at >= (u.first_exposed - INTERVAL '336 hours') AND e.occurred_at < u.first_exposed THEN 1 ELSE 0 END) AS m0_pre,
    SUM(CASE WHEN e.event IN ('order_placed') AND e.occurred_at >= u.first_exposed THEN 1 ELSE 0 END) AS m1_y,
    SUM(CASE WHEN e.event IN ('basket_viewed') AND e.occurred_at >= u.first_exposed THEN 1 ELSE 0 END) AS m1_in,
    SUM(CASE WHEN e.event IN ('order_placed') AND e.occurred_at >= (u.first_exposed - INTERVAL '336 hours') AND e.occurred_at < u.first_exposed THEN 1 ELSE 0 END) AS m1_pre,
    SUM(CASE WHEN e.event IN ('order_placed') AND e.occurred_at >= u.first_exposed THEN COALESCE(e.value, 0) ELSE 0 END) AS m2_y,
    SUM(CASE WHEN e.event IN ('order_placed') AND e.occurred_at >= (u.first_exposed - INTERVAL '336 hours') AND e.occurred_at < u.first_exposed THEN COALESCE(e.value, 0) ELSE 0 END) AS m2_pre,
    SUM(CASE WHEN e.event IN ('basket_viewed') AND e.occurred_at >= u.first_exposed AND e.occurred_at < (u.first_exposed + INTERVAL '72 hours') THEN 1 ELSE 0 END) AS m3_y,
    SUM(CASE WHEN e.event IN ('basket_viewed') AND e.occurred_at >= (u.first_exposed - INTERVAL '336 hours') AND e.occurred_at < u.first_exposed THEN 1 ELSE 0 END) AS m3_pre,
    SUM(CASE WHEN e.event IN ('order_placed') AND e.occurred_at >= u.first_exposed THEN 1 ELSE 0 END) AS m4_y,
    SUM(CASE WHEN e.event IN ('basket_viewed') AND e.occurred_at >= u.first_exposed THEN 1 ELSE 0 END) AS m4_x
  FROM units u
  JOIN event_rows e ON e.unit_id = u.unit_id
  GROUP BY u.unit_id
),
uncapped_values AS (
  SELECT u.unit_id, u.arm, u.exposure_day, u.segment_1, u.segment_2,
    1 AS m0_n,
    CASE WHEN COALESCE(ue.m0_y, 0) > 0 THEN 1 ELSE 0 END AS m0_y,
    CASE WHEN COALESCE(ue.m0_pre, 0) > 0 THEN 1 ELSE 0 END AS m0_pre,
    CASE WHEN COALESCE(ue.m1_in, 0) > 0 THEN 1 ELSE 0 END AS m1_n,
    CASE WHEN COALESCE(ue.m1_in, 0) > 0 THEN CASE WHEN COALESCE(ue.m1_y, 0) = 0 THEN 1 ELSE 0 END ELSE 0 END AS m1_y,
    CASE WHEN COALESCE(ue.m1_in, 0) > 0 THEN CASE WHEN COALESCE(ue.m1_pre, 0) = 0 THEN 1 ELSE 0 END ELSE 0 END AS m1_pre,
    1 AS m2_n,
    COALESCE(ue.m2_y, 0) AS m2_y,
    COALESCE(ue.m2_pre, 0) AS m2_pre,
    1 AS m3_n,
    COALESCE(ue.m3_y, 0) AS m3_y,
    COALESCE(ue.m3_pre, 0) AS m3_pre,
    1 AS m4_n,
    COALESCE(ue.m4_y, 0) AS m4_y,
    COALESCE(ue.m4_x, 0) AS m4_x
  FROM units u
  LEFT JOIN unit_events ue ON ue.unit_id = u.unit_id
),
cap_2 AS (
  SELECT MIN(value) AS cap
  FROM (
    SELECT m2_y AS value, ROW_NUMBER() OVER (ORDER BY m2_y) AS unit_rank, COUNT(*) OVER () AS unit_count
    FROM uncapped_values
  ) ranked
  WHERE unit_rank * 100 >= unit_count * 90
),
unit_values AS (
  SELECT v.unit_id, v.arm, v.exposure_day, v.segment_1, v.segment_2,
    v.m0_n,
    v.m0_y,
    v.m0_pre,
    v.m1_n,
    v.m1_y,
    v.m1_pre,
    v.m2_n,
    CASE WHEN v.m2_y > c2.cap THEN c2.cap ELSE v.m2_y END AS m2_y,
    v.m2_pre,
    v.m3_n,
    v.m3_y,
    v.m3_pre,
    v.m4_n,
    v.m4_y,
    v.m4_x
  FROM uncapped_values v
  CROSS JOIN cap_2 c2
),
by_arm AS (
  SELECT arm, CAST(NULL AS TEXT) AS bucket,
    COUNT(*) AS units,
    SUM(m0_n) AS m0_n,
    SUM(m0_y) AS m0_sy,
    SUM(m0_y * m0_y) AS m0_sy2,
    SUM(m0_pre) AS m0_sp,
    SUM(m0_pre * m0_pre) AS m0_sp2,
    SUM(m0_y * m0_pre) AS m0_syp,
    SUM(m1_n) AS m1_n,
    SUM(m1_y) AS m1_sy,
    SUM(m1_y * m1_y) AS m1_sy2,
    SUM(m1_pre) AS m1_sp,
    SUM(m1_pre * m1_pre) AS m1_sp2,
    SUM(m1_y * m1_pre) AS m1_syp,
    SUM(m2_n) AS m2_n,
    SUM(m2_y) AS m2_sy,
    SUM(m2_y * m2_y) AS m2_sy2,
    SUM(m2_pre) AS m2_sp,
    SUM(m2_pre * m2_pre) AS m2_sp2,
    SUM(m2_y * m2_pre) AS m2_syp,
    SUM(m3_n) AS m3_n,
    SUM(m3_y) AS m3_sy,
    SUM(m3_y * m3_y) AS m3_sy2,
    SUM(m3_pre) AS m3_sp,
    SUM(m3_pre * m3_pre) AS m3_sp2,
    SUM(m3_y * m3_pre) AS m3_syp,
    SUM(m4_n) AS m4_n,
    SUM(m4_y) AS m4_sy,
    SUM(m4_y * m4_y) AS m4_sy2,
    SUM(m4_x) AS m4_sx,
    SUM(m4_x * m4_x) AS m4_sx2,
    SUM(m4_y * m4_x) AS m4_sxy
  FROM unit_values
  GROUP BY arm
),
by_day AS (
  SELECT arm, exposure_day AS bucket,
    COUNT(*) AS units,
    SUM(m0_n) AS m0_n,
    SUM(m0_y) AS m0_sy,
    SUM(m0_y * m0_y) AS m0_sy2,
    SUM(m0_pre) AS m0_sp,
    SUM(m0_pre * m0_pre) AS m0_sp2,
    SUM(m0_y * m0_pre) AS m0_syp,
    SUM(m1_n) AS m1_n,
    SUM(m1_y) AS m1_sy,
    SUM(m1_y * m1_y) AS m1_sy2,
    SUM(m1_pre) AS m1_sp,
    SUM(m1_pre * m1_pre) AS m1_sp2,
    SUM(m1_y * m1_pre) AS m1_syp,
    SUM(m2_n) AS m2_n,
    SUM(m2_y) AS m2_sy,
    SUM(m2_y * m2_y) AS m2_sy2,
    SUM(m2_pre) AS m2_sp,
    SUM(m2_pre * m2_pre) AS m2_sp2,
    SUM(m2_y * m2_pre) AS m2_syp,
    SUM(m3_n) AS m3_n,
    SUM(m3_y) AS m3_sy,
    SUM(m3_y * m3_y) AS m3_sy2,
    SUM(m3_pre) AS m3_sp,
    SUM(m3_pre * m3_pre) AS m3_sp2,
    SUM(m3_y * m3_pre) AS m3_syp,
    SUM(m4_n) AS m4_n,
    SUM(m4_y) AS m4_sy,
    SUM(m4_y * m4_y) AS m4_sy2,
    SUM(m4_x) AS m4_sx,
    SUM(m4_x * m4_x) AS m4_sx2,
    SUM(m4_y * m4_x) AS m4_sxy
  FROM unit_values
  GROUP BY arm, exposure_day
),
by_segment_1 AS (
  SELECT arm, CONCAT('platform: ', segment_1) AS bucket,
    COUNT(*) AS units,
    SUM(m0_n) AS m0_n,
    SUM(m0_y) AS m0_sy,
    SUM(m0_y * m0_y) AS m0_sy2,
    SUM(m0_pre) AS m0_sp,
    SUM(m0_pre * m0_pre) AS m0_sp2,
    SUM(m0_y * m0_pre) AS m0_syp,
    SUM(m1_n) AS m1_n,
    SUM(m1_y) AS m1_sy,
    SUM(m1_y * m1_y) AS m1_sy2,
    SUM(m1_pre) AS m1_sp,
    SUM(m1_pre * m1_pre) AS m1_sp2,
    SUM(m1_y * m1_pre) AS m1_syp,
    SUM(m2_n) AS m2_n,
    SUM(m2_y) AS m2_sy,
    SUM(m2_y * m2_y) AS m2_sy2,
    SUM(m2_pre) AS m2_sp,
    SUM(m2_pre * m2_pre) AS m2_sp2,
    SUM(m2_y * m2_pre) AS m2_syp,
    SUM(m3_n) AS m3_n,
    SUM(m3_y) AS m3_sy,
    SUM(m3_y * m3_y) AS m3_sy2,
    SUM(m3_pre) AS m3_sp,
    SUM(m3_pre * m3_pre) AS m3_sp2,
    SUM(m3_y * m3_pre) AS m3_syp,
    SUM(m4_n) AS m4_n,
    SUM(m4_y) AS m4_sy,
    SUM(m4_y * m4_y) AS m4_sy2,
    SUM(m4_x) AS m4_sx,
    SUM(m4_x * m4_x) AS m4_sx2,
    SUM(m4_y * m4_x) AS m4_sxy
  FROM unit_values
  GROUP BY arm, segment_1
),
by_segment_2 AS (
  SELECT arm, CONCAT('country: ', segment_2) AS bucket,
    COUNT(*) AS units,
    SUM(m0_n) AS m0_n,
    SUM(m0_y) AS m0_sy,
    SUM(m0_y * m0_y) AS m0_sy2,
    SUM(m0_pre) AS m0_sp,
    SUM(m0_pre * m0_pre) AS m0_sp2,
    SUM(m0_y * m0_pre) AS m0_syp,
    SUM(m1_n) AS m1_n,
    SUM(m1_y) AS m1_sy,
    SUM(m1_y * m1_y) AS m1_sy2,
    SUM(m1_pre) AS m1_sp,
    SUM(m1_pre * m1_pre) AS m1_sp2,
    SUM(m1_y * m1_pre) AS m1_syp,
    SUM(m2_n) AS m2_n,
    SUM(m2_y) AS m2_sy,
    SUM(m2_y * m2_y) AS m2_sy2,
    SUM(m2_pre) AS m2_sp,
    SUM(m2_pre * m2_pre) AS m2_sp2,
    SUM(m2_y * m2_pre) AS m2_syp,
    SUM(m3_n) AS m3_n,
    SUM(m3_y) AS m3_sy,
    SUM(m3_y * m3_y) AS m3_sy2,
    SUM(m3_pre) AS m3_sp,
    SUM(m3_pre * m3_pre) AS m3_sp2,
    SUM(m3_y * m3_pre) AS m3_syp,
    SUM(m4_n) AS m4_n,
    SUM(m4_y) AS m4_sy,
    SUM(m4_y * m4_y) AS m4_sy2,
    SUM(m4_x) AS m4_sx,
    SUM(m4_x * m4_x) AS m4_sx2,
    SUM(m4_y * m4_x) AS m4_sxy
  FROM unit_values
  GROUP BY arm, segment_2
)
SELECT CAST('arm' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST(NULL AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(NULL AS BIGINT) AS n, CAST(NULL AS NUMERIC(38, 12)) AS sum_y, CAST(NULL AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre2, CAST(NULL AS NUMERIC(38, 12)) AS sum_ypre
FROM by_arm
UNION ALL
SELECT CAST('arm' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('ordered' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m0_n AS BIGINT) AS n, CAST(m0_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m0_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m0_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m0_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m0_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_arm
UNION ALL
SELECT CAST('arm' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('abandonment' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m1_n AS BIGINT) AS n, CAST(m1_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m1_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m1_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m1_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m1_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_arm
UNION ALL
SELECT CAST('arm' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('spend' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m2_n AS BIGINT) AS n, CAST(m2_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m2_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m2_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m2_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m2_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_arm
UNION ALL
SELECT CAST('arm' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('views' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m3_n AS BIGINT) AS n, CAST(m3_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m3_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m3_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m3_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m3_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_arm
UNION ALL
SELECT CAST('arm' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('orders-per-view' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m4_n AS BIGINT) AS n, CAST(m4_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m4_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(m4_sx AS NUMERIC(38, 12)) AS sum_x, CAST(m4_sx2 AS NUMERIC(38, 12)) AS sum_x2, CAST(m4_sxy AS NUMERIC(38, 12)) AS sum_xy, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre2, CAST(NULL AS NUMERIC(38, 12)) AS sum_ypre
FROM by_arm
UNION ALL
SELECT CAST('day' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST(NULL AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(NULL AS BIGINT) AS n, CAST(NULL AS NUMERIC(38, 12)) AS sum_y, CAST(NULL AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre2, CAST(NULL AS NUMERIC(38, 12)) AS sum_ypre
FROM by_day
UNION ALL
SELECT CAST('day' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('ordered' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m0_n AS BIGINT) AS n, CAST(m0_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m0_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m0_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m0_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m0_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_day
UNION ALL
SELECT CAST('day' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('abandonment' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m1_n AS BIGINT) AS n, CAST(m1_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m1_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m1_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m1_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m1_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_day
UNION ALL
SELECT CAST('day' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('spend' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m2_n AS BIGINT) AS n, CAST(m2_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m2_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m2_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m2_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m2_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_day
UNION ALL
SELECT CAST('day' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('views' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m3_n AS BIGINT) AS n, CAST(m3_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m3_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m3_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m3_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m3_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_day
UNION ALL
SELECT CAST('day' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('orders-per-view' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m4_n AS BIGINT) AS n, CAST(m4_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m4_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(m4_sx AS NUMERIC(38, 12)) AS sum_x, CAST(m4_sx2 AS NUMERIC(38, 12)) AS sum_x2, CAST(m4_sxy AS NUMERIC(38, 12)) AS sum_xy, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre2, CAST(NULL AS NUMERIC(38, 12)) AS sum_ypre
FROM by_day
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST(NULL AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(NULL AS BIGINT) AS n, CAST(NULL AS NUMERIC(38, 12)) AS sum_y, CAST(NULL AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre2, CAST(NULL AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_1
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('ordered' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m0_n AS BIGINT) AS n, CAST(m0_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m0_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m0_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m0_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m0_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_1
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('abandonment' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m1_n AS BIGINT) AS n, CAST(m1_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m1_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m1_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m1_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m1_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_1
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('spend' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m2_n AS BIGINT) AS n, CAST(m2_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m2_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m2_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m2_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m2_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_1
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('views' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m3_n AS BIGINT) AS n, CAST(m3_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m3_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m3_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m3_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m3_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_1
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('orders-per-view' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m4_n AS BIGINT) AS n, CAST(m4_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m4_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(m4_sx AS NUMERIC(38, 12)) AS sum_x, CAST(m4_sx2 AS NUMERIC(38, 12)) AS sum_x2, CAST(m4_sxy AS NUMERIC(38, 12)) AS sum_xy, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre2, CAST(NULL AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_1
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST(NULL AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(NULL AS BIGINT) AS n, CAST(NULL AS NUMERIC(38, 12)) AS sum_y, CAST(NULL AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre2, CAST(NULL AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_2
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('ordered' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m0_n AS BIGINT) AS n, CAST(m0_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m0_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m0_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m0_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m0_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_2
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('abandonment' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m1_n AS BIGINT) AS n, CAST(m1_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m1_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m1_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m1_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m1_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_2
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('spend' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m2_n AS BIGINT) AS n, CAST(m2_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m2_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m2_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m2_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m2_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_2
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('views' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m3_n AS BIGINT) AS n, CAST(m3_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m3_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(m3_sp AS NUMERIC(38, 12)) AS sum_pre, CAST(m3_sp2 AS NUMERIC(38, 12)) AS sum_pre2, CAST(m3_syp AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_2
UNION ALL
SELECT CAST('segment' AS TEXT) AS grain, arm AS arm, bucket AS bucket, CAST('orders-per-view' AS TEXT) AS metric, CAST(units AS BIGINT) AS units, CAST(m4_n AS BIGINT) AS n, CAST(m4_sy AS NUMERIC(38, 12)) AS sum_y, CAST(m4_sy2 AS NUMERIC(38, 12)) AS sum_y2, CAST(m4_sx AS NUMERIC(38, 12)) AS sum_x, CAST(m4_sx2 AS NUMERIC(38, 12)) AS sum_x2, CAST(m4_sxy AS NUMERIC(38, 12)) AS sum_xy, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre2, CAST(NULL AS NUMERIC(38, 12)) AS sum_ypre
FROM by_segment_2
UNION ALL
SELECT CAST('excluded' AS TEXT) AS grain, CAST(NULL AS TEXT) AS arm, CAST('several-arms' AS TEXT) AS bucket, CAST(NULL AS TEXT) AS metric, CAST(COUNT(*) AS BIGINT) AS units, CAST(NULL AS BIGINT) AS n, CAST(NULL AS NUMERIC(38, 12)) AS sum_y, CAST(NULL AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre2, CAST(NULL AS NUMERIC(38, 12)) AS sum_ypre
FROM first_exposures
WHERE arm <> last_arm
UNION ALL
SELECT CAST('excluded' AS TEXT) AS grain, CAST(NULL AS TEXT) AS arm, CAST('unknown-arm' AS TEXT) AS bucket, CAST(NULL AS TEXT) AS metric, CAST(COUNT(DISTINCT unit_id) AS BIGINT) AS units, CAST(COUNT(*) AS BIGINT) AS n, CAST(NULL AS NUMERIC(38, 12)) AS sum_y, CAST(NULL AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre2, CAST(NULL AS NUMERIC(38, 12)) AS sum_ypre
FROM exposure_rows
WHERE exposed_at IS NOT NULL
  AND (arm IS NULL OR arm NOT IN ('control', 'shortcut'))
UNION ALL
SELECT CAST('excluded' AS TEXT) AS grain, CAST(NULL AS TEXT) AS arm, CAST('no-exposure-time' AS TEXT) AS bucket, CAST(NULL AS TEXT) AS metric, CAST(COUNT(DISTINCT unit_id) AS BIGINT) AS units, CAST(COUNT(*) AS BIGINT) AS n, CAST(NULL AS NUMERIC(38, 12)) AS sum_y, CAST(NULL AS NUMERIC(38, 12)) AS sum_y2, CAST(NULL AS NUMERIC(38, 12)) AS sum_x, CAST(NULL AS NUMERIC(38, 12)) AS sum_x2, CAST(NULL AS NUMERIC(38, 12)) AS sum_xy, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre, CAST(NULL AS NUMERIC(38, 12)) AS sum_pre2, CAST(NULL AS NUMERIC(38, 12)) AS sum_ypre
FROM exposure_rows
WHERE exposed_at IS NULL
