export interface paths {
    "/structures": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Structures the caller can see */
        get: operations["getStructures"];
        put?: never;
        /**
         * Create a structure
         * @description Roles: admin, engineer.
         */
        post: operations["postStructures"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** One structure with its gauges, each with its condition now (`condition: { state, since, faults, stale }`), and its count of open alerts */
        get: operations["getStructuresByCode"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Gauges of a structure, retired ones included */
        get: operations["getStructuresByCodeGauges"];
        put?: never;
        /**
         * Register a gauge (tags are unique per structure)
         * @description Roles: admin, engineer, technician.
         */
        post: operations["postStructuresByCodeGauges"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** One gauge */
        get: operations["getStructuresByCodeGaugesByTag"];
        put?: never;
        post?: never;
        /**
         * Retire the gauge: it accepts no more readings; its history is kept
         * @description Roles: admin, engineer, technician.
         */
        delete: operations["deleteStructuresByCodeGaugesByTag"];
        options?: never;
        head?: never;
        /**
         * Change fields of a gauge (the whole gauge is checked again); stored readings keep their derived values
         * @description Roles: admin, engineer, technician.
         */
        patch: operations["patchStructuresByCodeGaugesByTag"];
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/zero": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Set a new zero (reference) reading, typed or the average of the last N raw readings; the previous one stays in the history
         * @description Roles: admin, engineer, technician.
         */
        post: operations["postStructuresByCodeGaugesByTagZero"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/shunt-checks": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The gauge's shunt-calibration checks, newest first */
        get: operations["getStructuresByCodeGaugesByTagShuntChecks"];
        put?: never;
        /**
         * Record a shunt-calibration check: the resistor placed across the gauge and the output change the logger showed; the expected output is computed from the gauge's bridge and judged against the tolerance. Refused (400) for a gauge that is not a foil bridge or has no gauge resistance recorded; nothing is stored then
         * @description Roles: admin, engineer, technician.
         */
        post: operations["postStructuresByCodeGaugesByTagShuntChecks"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/limits": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The gauge's limits */
        get: operations["getStructuresByCodeGaugesByTagLimits"];
        /**
         * Replace the gauge's limits. Refused: lower ≥ upper, negative dead band or persistence, levels out of order
         * @description Roles: admin, engineer.
         */
        put: operations["putStructuresByCodeGaugesByTagLimits"];
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/limits/backtest": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /** What proposed limits would have raised over [from, to) of stored readings, by the same evaluation as ingestion; nothing is stored */
        post: operations["postStructuresByCodeGaugesByTagLimitsBacktest"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/thermal-model": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The gauge's thermal model in force */
        get: operations["getStructuresByCodeGaugesByTagThermalModel"];
        /**
         * Fit stress-producing strain = a + b·T(t − lag) (+ c·days with drift) by ordinary least squares over the reference period's healthy readings, and store it as the gauge's model
         * @description Roles: admin, engineer.
         *
         *     Replaces the model in force (the audit trail keeps the old one). The residual, measured − model in µε, is then stored for every reading: recomputed at once for the readings already stored (before the period too), and computed on ingest for new ones; read it as `quantity=residual` in the series, and bound it with `residual` limits. Open residual alerts close, since they were measured against the old model. Refused (400, saying what is needed): fewer than 24 readings with a temperature in the period, less than 3 °C of temperature range, a fixed lag or an "auto" search bound longer than the period. A thermal model is a statistical fit, valid inside the reference period's temperature range; what its residual means is for engineering judgement.
         */
        put: operations["putStructuresByCodeGaugesByTagThermalModel"];
        post?: never;
        /**
         * Remove the thermal model; stored residuals go back to null. Refused (409) while residual limits stand
         * @description Roles: admin, engineer.
         */
        delete: operations["deleteStructuresByCodeGaugesByTagThermalModel"];
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/thermal-model/fit": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /** The same fit as PUT, with its scatter of strain against lagged temperature, without storing anything: a preview before saving */
        post: operations["postStructuresByCodeGaugesByTagThermalModelFit"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/rosettes": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Rosettes of a structure */
        get: operations["getStructuresByCodeRosettes"];
        put?: never;
        /**
         * Group three gauges of the structure as a rosette (gauges a, b, c at 0°, 45°/60°, 90°/120°; material from gauge a)
         * @description Roles: admin, engineer, technician.
         */
        post: operations["postStructuresByCodeRosettes"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/rosettes/{tag}/limits": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The rosette's limits on sigma1, sigma2 and vonMises (MPa) */
        get: operations["getStructuresByCodeRosettesByTagLimits"];
        /**
         * Replace the rosette's limits. Refused as for a gauge's; evaluated on ingest from readings of the three gauges with the same timestamp
         * @description Roles: admin, engineer.
         *
         *     A reading completing an instant older than the rosette's last evaluated one is evaluated by replaying from an hourly checkpoint, as for a gauge's limits (kept three days); an instant using a reading sensor health or the rated range marks as a fault is skipped.
         */
        put: operations["putStructuresByCodeRosettesByTagLimits"];
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/rosettes/{tag}/limits/backtest": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * What proposed rosette limits would have raised over [from, to) of stored readings, by the same evaluation as ingestion (faulty gauge readings skipped); nothing is stored
         * @description `readingsChecked` counts the instants at which all three gauges have a reading.
         */
        post: operations["postStructuresByCodeRosettesByTagLimitsBacktest"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/rosettes/{tag}/series": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * A rosette's sigma1, sigma2, vonMises, tauMax (MPa) or theta (degrees) in at most `points` buckets
         * @description Computed from readings of the three gauges with the same timestamp (plane stress, material of gauge a); buckets as for a gauge's series.
         */
        get: operations["getStructuresByCodeRosettesByTagSeries"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/alerts": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Alerts of a structure, newest first, filtered and paged: `total` counts every match, `nextCursor` fetches the next page */
        get: operations["getStructuresByCodeAlerts"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/alerts/{id}/acknowledge": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Acknowledge an alert with a comment
         * @description Roles: admin, engineer.
         */
        post: operations["postAlertsByIdAcknowledge"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/alerts/{id}/resolve": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Resolve a jump (a sensor alert with code jump): accept the step as real, or record a new zero
         * @description Roles: admin, engineer.
         *
         *     After a jump the gauge's readings are kept out of limit evaluation (readings.fault marks them after-jump) until this is done. accept-step evaluates them against the limits from the jump on, raising any alerts they would have raised; new-zero records the reading at the jump as the gauge's zero (as POST /gauges/{tag}/zero does) and leaves the readings between set aside. Either clears the alert. A jump cannot be cleared by hand.
         */
        post: operations["postAlertsByIdResolve"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/drawings": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Drawings (elevations, plans) of a structure */
        get: operations["getStructuresByCodeDrawings"];
        put?: never;
        /**
         * Upload a drawing
         * @description Roles: admin, engineer, technician.
         */
        post: operations["postStructuresByCodeDrawings"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/photos": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Installation photos of a gauge */
        get: operations["getStructuresByCodeGaugesByTagPhotos"];
        put?: never;
        /**
         * Upload an installation photo of a gauge
         * @description Roles: admin, engineer, technician.
         */
        post: operations["postStructuresByCodeGaugesByTagPhotos"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/placement": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        /**
         * Place a gauge on a drawing of its structure (x, y: fractions of width and height from the top left), or take it off
         * @description Roles: admin, engineer, technician.
         */
        put: operations["putStructuresByCodeGaugesByTagPlacement"];
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/fatigue": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Fatigue of a gauge over [from, to): rainflow counting (ASTM E1049) of the stored stress, S-N curve of the detail category (EN 1993-1-9 shape), Palmgren–Miner damage, rate per year and implied life. Readings beyond the gauge's rated range are left out. */
        get: operations["getStructuresByCodeGaugesByTagFatigue"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/readings": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Send readings (JSON or CSV)
         * @description Roles: admin, engineer, technician, or the structure's logger token.
         *
         *     At most 50 000 readings and 10 MB per request (413 past that). All valid readings of a request are stored in one transaction, or none. Each reading is checked on its own; `rejected[].code` is one of: `invalid-reading` (The reading is not a JSON object with gauge, time and value.); `wrong-column-count` (A CSV row has more or fewer fields than the header (a decimal comma splits a number in two).); `missing-gauge` (The reading names no gauge tag.); `unknown-gauge` (No gauge of the structure has this tag.); `retired-gauge` (The gauge is retired and takes no more readings.); `gauge-not-convertible` (The gauge's stored configuration cannot convert readings; fix the gauge first.); `missing-time` (The reading has no time.); `invalid-time` (The time is not ISO-8601 with a date, lacks an offset where one is required, or is before 1970.); `time-in-future` (The time is more than 5 minutes ahead of the server's clock.); `missing-value` (The reading has no value.); `not-finite` (The value, or the temperature, strain or stress it converts to, is not a finite number (text, NaN, Infinity, or a value so far outside anything a gauge reads that its conversion overflows).); `before-zero` (The time is earlier than the gauge's first zero reading, from which its strain is measured.); `temperature-out-of-range` (The temperature is outside −80…+150 °C, beyond what a strain gauge installation reads.); `temperature-required` (The gauge's temperature compensation needs the temperature at each reading.); `non-positive-frequency` (A vibrating-wire frequency must be above 0 Hz.); `non-positive-frequency-squared` (A vibrating-wire reading in f²/1000 must be above 0.); `impossible-bridge-output` (No bridge of the gauge's arrangement can produce this output change.). Times are stored to the millisecond. A reading whose (gauge, time) is already stored, or that repeats an earlier reading of the same request, counts as a duplicate and is not stored again (the first one is kept).
         */
        post: operations["postStructuresByCodeReadings"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/bursts": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Send bursts of a dynamic gauge (JSON, or one burst as 32-bit little-endian floats)
         * @description Roles: admin, engineer, technician, or the structure's logger token.
         *
         *     At most 2 000 000 samples and 16 MB per request (413 past that). All valid bursts of a request are stored in one transaction, or none. Samples are converted like readings (one temperature per burst) and kept only as summaries per interval of the gauge's `summaryMinutes` (aligned to the hour), rainflow histograms and captured event waveforms. Rainflow carries its residue from one burst to the next of the gauge; a burst older than the newest one stored is counted on its own, its open half cycles closed at its end. A burst whose (gauge, start) is stored, or repeated in the request, is a duplicate; one that overlaps another without the same start is rejected (`overlap`). A burst with any non-finite sample (NaN, Infinity, null, text) is refused whole (`not-finite`), in JSON and binary alike. Limits apply to each burst's lowest and highest sample and its last one, as readings at their own instants; those three are stored as readings. Each burst is checked on its own; `rejected[].code` is one of: `invalid-burst` (The burst is not an object with gauge, start, rateHz and values.); `missing-gauge` (The burst names no gauge tag.); `unknown-gauge` (No gauge of the structure has this tag.); `retired-gauge` (The gauge is retired and takes no more data.); `gauge-not-convertible` (The gauge's stored configuration cannot convert samples; fix the gauge first.); `not-dynamic` (The gauge is static: send its data as readings, or make it dynamic first.); `invalid-time` (The start is not ISO-8601 with Z or an offset, or is before 1970.); `time-in-future` (The burst ends more than 5 minutes ahead of the server's clock.); `before-zero` (The burst starts earlier than the gauge's first zero reading, from which its strain is measured.); `temperature-out-of-range` (The burst's temperature is outside −80…+150 °C, beyond what a strain gauge installation reads.); `wrong-rate` (rateHz is not the gauge's rate.); `empty-burst` (The burst has no samples.); `not-finite` (A sample or the burst's temperature (or the strain or stress a sample converts to) is not a finite number: NaN, Infinity, text or null. The whole burst is refused.); `temperature-required` (The gauge's temperature compensation needs the burst's temperature.); `non-positive-frequency` (A vibrating-wire frequency must be above 0 Hz.); `non-positive-frequency-squared` (A vibrating-wire reading in f²/1000 must be above 0.); `impossible-bridge-output` (No bridge of the gauge's arrangement can produce this output change.); `overlap` (The burst overlaps a stored burst of the same gauge, or another burst of the request, without starting at the same instant.). A binary body that is not a whole number of 4-byte floats, or a missing query parameter, is a 400.
         */
        post: operations["postStructuresByCodeBursts"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/summaries": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * A dynamic gauge's interval summaries starting in [from, to), oldest first (stress in MPa)
         * @description At most 5 000 intervals per request; ask for a shorter range for more.
         */
        get: operations["getStructuresByCodeGaugesByTagSummaries"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/events": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * A dynamic gauge's captured events starting in [from, to), newest first, without their waveforms
         * @description At most 1 000 events per request.
         */
        get: operations["getStructuresByCodeGaugesByTagEvents"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/events/{id}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** One captured event with its waveform: stress in MPa at `rateHz` from `start` */
        get: operations["getStructuresByCodeEventsById"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        /**
         * Label an event (what it was); null clears the label. Audited
         * @description Roles: admin, engineer.
         */
        patch: operations["patchStructuresByCodeEventsById"];
        trace?: never;
    };
    "/structures/{code}/uploads": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Upload a logger file of any size (CSV, streamed)
         * @description Roles: admin, engineer, technician, or the structure's logger token.
         *
         *     Header `gauge,time,value,temperature` (any order, case-insensitive; `temperature` may be left out; a UTF-8 byte-order mark is skipped; blank lines are ignored). Separated by commas with decimals written with a point: a semicolon- or tab-separated file is refused with a 400 before any row is read, a missing or unknown column with a 400 naming it, and a row with too many or too few fields (e.g. an unquoted decimal comma) is rejected on its own (`wrong-column-count`). Times are ISO-8601 (`T` or a space between date and time); without an offset they are read in `?timezone=` or else the structure's time zone (a time that happens twice when clocks go back is the earlier one; one skipped when they go forward is read with the offset before the change). The body is read as it arrives and stored in batches of 5 000 rows, each its own transaction, so a file of millions of rows is never held whole. The header is checked before anything is stored (400). The answer is newline-delimited JSON: `{"type":"start","timezone"}`, then `{"type":"progress","bytes","rows","accepted","duplicates","rejected"}` after each batch, then `{"type":"done","rows","accepted","duplicates","rejected","gauges":[{"gauge","readings","from","to"}],"rejections":[{"line","code","message"}],"rejectionsTruncated","alerts"}` (gauges: readings stored per gauge and the UTC times they span) (`line` counts the header as line 1; the first 10 000 rejected rows are listed), or `{"type":"error","error":{code,message}}` if the file cannot be read to its end: the batches reported before stay stored, and sending the file again is safe. Each reading is checked on its own; `rejected[].code` is one of: `invalid-reading` (The reading is not a JSON object with gauge, time and value.); `wrong-column-count` (A CSV row has more or fewer fields than the header (a decimal comma splits a number in two).); `missing-gauge` (The reading names no gauge tag.); `unknown-gauge` (No gauge of the structure has this tag.); `retired-gauge` (The gauge is retired and takes no more readings.); `gauge-not-convertible` (The gauge's stored configuration cannot convert readings; fix the gauge first.); `missing-time` (The reading has no time.); `invalid-time` (The time is not ISO-8601 with a date, lacks an offset where one is required, or is before 1970.); `time-in-future` (The time is more than 5 minutes ahead of the server's clock.); `missing-value` (The reading has no value.); `not-finite` (The value, or the temperature, strain or stress it converts to, is not a finite number (text, NaN, Infinity, or a value so far outside anything a gauge reads that its conversion overflows).); `before-zero` (The time is earlier than the gauge's first zero reading, from which its strain is measured.); `temperature-out-of-range` (The temperature is outside −80…+150 °C, beyond what a strain gauge installation reads.); `temperature-required` (The gauge's temperature compensation needs the temperature at each reading.); `non-positive-frequency` (A vibrating-wire frequency must be above 0 Hz.); `non-positive-frequency-squared` (A vibrating-wire reading in f²/1000 must be above 0.); `impossible-bridge-output` (No bridge of the gauge's arrangement can produce this output change.). Times are stored to the millisecond. A reading whose (gauge, time) is already stored, or that repeats an earlier reading of the same request, counts as a duplicate and is not stored again (the first one is kept).
         */
        post: operations["postStructuresByCodeUploads"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/readings": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Stored readings of a gauge with their derived values, oldest first
         * @description Pages of `limit` readings; pass `nextCursor` back as `cursor` for the next page (absent on the last). With `Accept: text/csv` the whole range is streamed as CSV (`time,value,temperature,strain,stress,flags`, flags space-separated) and `limit` is ignored. Raw value and temperature are written as received; strain and stress to the resolution of the gauge's readings (one step of the finest raw decimal, through the gauge's conversion). `header=units` names the same columns with their units (`time (UTC)`, `value (<input unit>)`, `temperature (°C)`, `strain (µε)`, `stress (MPa)`, `flags`) after a UTF-8 byte-order mark, for spreadsheets.
         */
        get: operations["getStructuresByCodeGaugesByTagReadings"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/gauges/{tag}/series": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * A gauge's strain, stress or temperature in at most `points` buckets
         * @description Buckets have a round width (1 s … 1 week, then whole weeks) aligned to the Unix epoch, so the first and last may reach outside the range. Each bucket's min and max are exact (a one-reading spike always shows); fine buckets come from the readings, buckets of whole hours or days from roll-ups. Buckets without readings are left out, so gaps stay gaps.
         */
        get: operations["getStructuresByCodeGaugesByTagSeries"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/report": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The structure's report for a period of whole days in the structure's time zone: status over the period and now, per gauge the stress and strain extremes, utilisation peak, data completeness and gaps, fatigue damage; the alerts open in the period and how they were handled; the cautions */
        get: operations["getStructuresByCodeReport"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/load-tests": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The structure's diagnostic load tests, newest window first */
        get: operations["getStructuresByCodeLoadTests"];
        put?: never;
        /**
         * Record a load test: its window, the load, and the predicted peak strain per gauge (as a list or as CSV text). Audited
         * @description Roles: admin, engineer.
         *
         *     Every gauge named must be the structure's: unknown tags are all named in one 400 (`details.unknownGauges`) and nothing is stored. A window holding no data is stored all the same (a logger file often arrives after the test): the answer's `dataState` is `none` and each gauge says `no-data` until readings arrive. Results are worked out when read. Per gauge, the baseline is the last believed reading before the window start (for a dynamic gauge: the mean of the last summary interval ended by then); the measured peak is the largest change from it in the sign of the prediction (tension positive), and the ratio is measured ÷ predicted. Readings with a sensor-health verdict or beyond the gauge's rated range are left out.
         */
        post: operations["postStructuresByCodeLoadTests"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/load-tests/{id}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** One load test with its results per gauge: baseline, measured peak, predicted, ratio */
        get: operations["getStructuresByCodeLoadTestsById"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/load-tests/{id}/results.csv": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The results table as CSV, units in the header (strain to 0.1 µε, ratios to 0.01; empty cells where nothing was measured) */
        get: operations["getStructuresByCodeLoadTestsByIdResultsCsv"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/certificates": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Calibration certificates of the structure's gauges and loggers, soonest expiry first, each with where it stands today on the structure's clock */
        get: operations["getStructuresByCodeCertificates"];
        put?: never;
        /**
         * Record a calibration certificate of a gauge or a logger, with its file. Audited
         * @description Roles: admin, engineer, technician.
         *
         *     The expiry must fall after the issue date; an unknown gauge tag is a 400 naming it; a file that is not a whole PDF or a PNG, JPEG or WebP image is refused (415, or 400 for a damaged one). Nothing is stored unless all of it is. Reminders: once a day, each certificate that has come within a threshold of its expiry (CERTIFICATE_REMINDER_DAYS, default 30 days) is e-mailed once per threshold to the structure's technicians and engineers, unless a later certificate of the same instrument expires after it.
         */
        post: operations["postStructuresByCodeCertificates"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/certificates/{id}/file": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The certificate's file as the type detected at upload (a PDF as an attachment) */
        get: operations["getStructuresByCodeCertificatesByIdFile"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/structures/{code}/site-visits": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The structure's site visits, newest first, a page at a time; `?gauge=` keeps those naming one gauge */
        get: operations["getStructuresByCodeSiteVisits"];
        put?: never;
        /**
         * Record a site visit: when, who, what was done, the gauges it touched and its photos. Audited
         * @description Roles: admin, engineer, technician.
         *
         *     Send JSON (no photos) or multipart/form-data with the photos. Every gauge named must be the structure's (unknown tags are all named in one 400, `details.unknownGauges`); every photo must be a PNG, JPEG or WebP image (415 otherwise). Nothing is stored unless all of it is.
         */
        post: operations["postStructuresByCodeSiteVisits"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/files/{id}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The bytes of a photo or drawing, as the type detected at upload (X-Content-Type-Options: nosniff) */
        get: operations["getFilesById"];
        put?: never;
        post?: never;
        /**
         * Delete a photo or drawing; gauges placed on a deleted drawing come off it
         * @description Roles: admin, engineer, technician.
         */
        delete: operations["deleteFilesById"];
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
}
export type webhooks = Record<string, never>;
export interface components {
    schemas: {
        AcknowledgeInput: {
            comment: string;
        };
        Alert: {
            id: number;
            structure: string;
            gauge: string;
            /** @description For an alert on a rosette's sigma1, sigma2 or vonMises: its tag (gauge is then its gauge a) */
            rosette: string | null;
            /** @enum {string} */
            kind: "limit" | "sensor";
            /** @enum {string} */
            level: "watch" | "warning" | "critical";
            quantity: string | null;
            /** @description Sensor alerts: stale, flat-line, jump or out-of-range */
            code: string | null;
            message: string | null;
            openedAt: string;
            bound: number | null;
            /** @description The furthest value beyond the bound so far in the episode; keeps rising while the alert is open */
            peak: number | null;
            /** @description When the episode reached its peak */
            peakAt: string | null;
            /** @description How many times the episode opened: an alert back beyond within an hour of clearing continues the same episode */
            openings: number;
            /** @description Set once the alert has opened 3 times within an hour: its crossings are then e-mailed as one, with a summary when it settles */
            flappingSince: string | null;
            acknowledgedAt: string | null;
            acknowledgedBy: string | null;
            clearedAt: string | null;
            comment: string | null;
        };
        AlertList: {
            alerts: components["schemas"]["Alert"][];
            /** @description Alerts matching the filters in all, on every page */
            total: number;
            /** @description Pass as `cursor` for the next page; null on the last page */
            nextCursor: string | null;
        };
        Backtest: {
            /** @description epoch ms */
            from: number;
            /** @description epoch ms */
            to: number;
            readingsChecked: number;
            episodes: {
                quantity: string;
                level: string;
                openedAt: number;
                peak: number;
                /** @description null: still open at the end of the period */
                clearedAt: number | null;
            }[];
        };
        BacktestInput: {
            limits: {
                /** @enum {string} */
                quantity: "stress" | "strain" | "utilisation" | "residual";
                /** @enum {string} */
                level: "watch" | "warning" | "critical";
                /** @description MPa for stress, µε for strain, a fraction of yield for utilisation */
                upper?: number;
                lower?: number;
                /** @description Dead band a value must come back inside the bound by to clear; same unit */
                hysteresis?: number;
                /** @description Consecutive readings needed to open or clear; default 1 */
                persistence?: number;
            }[];
            /** Format: date-time */
            from: string;
            /** Format: date-time */
            to: string;
        };
        BurstResult: {
            /** @description Samples taken into summaries by this request */
            accepted: number;
            /** @description Bursts stored by this request */
            bursts: number;
            /** @description Bursts whose (gauge, start) was already stored, or repeated in the request */
            duplicates: number;
            rejected: {
                /** @description Position in `bursts` (0 for a binary body) */
                index: number;
                code: string;
                message: string;
            }[];
            /** @description Event waveforms captured and stored by this request */
            events: number;
            alerts: {
                opened: number;
                escalated: number;
                cleared: number;
            };
        };
        BurstsInput: {
            /** @description At most 2 000 000 samples (and 16 MB) per request; more is a 413. */
            bursts: unknown[];
        };
        BurstSummaries: {
            /** @constant */
            unit: "MPa";
            intervals: {
                start: string;
                end: string;
                samples: number;
                min: number;
                max: number;
                mean: number;
                /** @description RMS about the interval's mean, MPa */
                rms: number;
                /** @description Largest rainflow range closed in the interval (full or half cycle), MPa */
                maxRange: number;
                /** @description Rainflow cycles closed in the interval; two half cycles make one */
                cycles: number;
            }[];
        };
        CalibrationCertificate: {
            id: number;
            /** @description Tag of the gauge the certificate is for; null for a logger's */
            gauge: string | null;
            /** @description Name of the logger the certificate is for; null for a gauge's */
            logger: string | null;
            /** @description Certificate number as printed */
            number: string;
            /** @description The calibration laboratory */
            issuedBy: string;
            /** @description YYYY-MM-DD */
            issuedOn: string;
            /** @description YYYY-MM-DD, the last day it is valid on the structure's clock */
            expiresOn: string;
            /**
             * @description `expired` after the expiry day; `expiring` within the longest reminder threshold; else `valid`
             * @enum {string}
             */
            state: "expired" | "expiring" | "valid";
            /** @description Days from the structure's today to the expiry day (negative once expired) */
            daysLeft: number;
            /** @description The state in words with the date, e.g. "Expires in 12 days, on 2026-07-01" */
            standing: string;
            /** @description Number of a later certificate of the same instrument that expires later, which takes this one's place (no reminders then) */
            replacedBy: string | null;
            file: {
                url: string;
                /** @description application/pdf or an image type, detected from the content */
                contentType: string;
                bytes: number;
            };
            createdBy: string;
            /** @description UTC, ISO-8601 with milliseconds */
            createdAt: string;
        };
        CertificateList: {
            /** @description The structure's date now, YYYY-MM-DD: what `daysLeft` counts from */
            today: string;
            /** @description Days before expiry a reminder goes to the structure's technicians and engineers (CERTIFICATE_REMINDER_DAYS) */
            reminderDays: number[];
            /** @description Soonest expiry first */
            certificates: components["schemas"]["CalibrationCertificate"][];
        };
        DrawingList: {
            drawings: components["schemas"]["File"][];
        };
        Error: {
            error: {
                /** @example validation_failed */
                code: string;
                message: string;
                details?: unknown;
            };
        };
        EventDetail: {
            id: number;
            gauge: string;
            start: string;
            end: string;
            /** @description Stress furthest beyond the trigger, MPa */
            peak: number;
            peakAt: string;
            /** @enum {string} */
            trigger: "above" | "below";
            /** @description The level crossed, MPa */
            triggerLevel: number;
            /** @description True when the waveform reached the cap and its tail was cut */
            truncated: boolean;
            label: string | null;
            rateHz: number;
            /** @constant */
            unit: "MPa";
            /** @description Samples from preSeconds before the first beyond the trigger to postSeconds after the last, MPa */
            stress: number[];
            /** @description Limit alerts of the gauge that opened, or reached their peak, within the event's waveform, oldest first */
            alerts: {
                id: number;
                /** @enum {string} */
                level: "watch" | "warning" | "critical";
                openedAt: string;
            }[];
        };
        EventLabelInput: {
            /** @description What the event was, e.g. "heavy vehicle" or "false trigger"; null clears it */
            label?: string;
        };
        EventList: {
            events: {
                id: number;
                gauge: string;
                start: string;
                end: string;
                /** @description Stress furthest beyond the trigger, MPa */
                peak: number;
                peakAt: string;
                /** @enum {string} */
                trigger: "above" | "below";
                /** @description The level crossed, MPa */
                triggerLevel: number;
                /** @description True when the waveform reached the cap and its tail was cut */
                truncated: boolean;
                label: string | null;
            }[];
        };
        File: {
            id: number;
            /** @enum {string} */
            kind: "photo" | "drawing" | "certificate" | "visit-photo";
            title: string;
            /**
             * @description Detected from the content, not the name
             * @enum {string}
             */
            contentType: "image/png" | "image/jpeg" | "image/webp";
            bytes: number;
            /** @description Pixels */
            width: number | null;
            /** @description Pixels */
            height: number | null;
            /** @description Tag of the gauge a photo shows; null for drawings */
            gauge: string | null;
            /** @description Where the bytes are served: /api/v1/files/{id} */
            url: string;
            /** @description UTC, ISO-8601 with milliseconds */
            createdAt: string;
        };
        /** @description The gauge: every field of the request, plus status, retiredAt, replaces, replacedBy, drawing (`{ id, x, y } | null`) and createdAt */
        Gauge: {
            [key: string]: unknown;
        };
        GaugeCondition: {
            /**
             * @description The first that holds, in this order: critical, warning, watch (an open limit alert of that level), sensor-fault (an open sensor fault: its readings are not believed), no-data (no reading yet, or none for three expected intervals), within-limits, no-limits (readings arrive but the gauge has no limits to judge them by)
             * @enum {string}
             */
            state: "critical" | "warning" | "watch" | "sensor-fault" | "no-data" | "within-limits" | "no-limits";
            /** @description Since when the state holds, UTC; null when it cannot be told */
            since: string | null;
            /** @description Codes of the open sensor faults (jump, flat-line, out-of-range), oldest first */
            faults: string[];
            /** @description No reading for three expected intervals: the data are old whatever the state */
            stale: boolean;
        };
        GaugeFatigue: {
            /** @description Rainflow histogram: occupied range bins ascending, half cycles counted as 0.5 */
            cycles: {
                /** @description Upper edge of the range bin, MPa */
                range: number;
                count: number;
            }[];
            /** @description Palmgren–Miner sum D over the period, from the exact (unbinned) ranges */
            damage: number;
            /** @description Detail category Δσ_C used, MPa at 2×10⁶ cycles */
            category: number;
            /** @description Cycles counted, half cycles as 0.5 */
            cyclesCounted: number;
            /**
             * @description readings: rainflow over the stored static readings (sees daily and seasonal cycles only); bursts: the rainflow histograms stored from a dynamic gauge's bursts
             * @enum {string}
             */
            source: "readings" | "bursts";
            /** @description Damage-equivalent constant range Δσ_E = (Σ nᵢ·Δσᵢ³ / 2×10⁶)^(1/3), MPa: compare it with the detail category Δσ_C */
            equivalentRange: number;
            /** @description Miner damage per day of the structure's time zone with data (bursts source; empty for readings) */
            damagePerDay: {
                /** @description Day in the structure's time zone, YYYY-MM-DD */
                day: string;
                damage: number;
            }[];
            /** @description Bursts source: samples summarised over the period */
            samplesCounted?: number;
            /** @description Start of the period, included (UTC) */
            from: string;
            /** @description End of the period, excluded (UTC) */
            to: string;
            /** @description Seconds from `from` to `to` */
            periodSeconds: number;
            /** @description First reading counted (UTC); null when none */
            firstReading: string | null;
            /** @description Last reading counted (UTC); null when none */
            lastReading: string | null;
            /** @description Seconds from the first to the last reading counted */
            observedSeconds: number;
            /** @description Seconds covered by data: the sum of the intervals between readings counted, leaving out gaps longer than `longestCoveredIntervalSeconds`. The rate divides by it, so that an outage does not dilute the rate and overstate the life */
            coveredSeconds: number;
            /** @description Intervals without readings longer than `longestCoveredIntervalSeconds`, left out of `coveredSeconds` */
            gapsLeftOut: number;
            /** @description Their total length, seconds */
            gapSeconds: number;
            /** @description 3 × the gauge's expected interval (600 s when it has none) */
            longestCoveredIntervalSeconds: number;
            /** @description Histories counted one by one: rainflow restarts at each new zero reading, so the step a re-zero makes is never counted as a stress range */
            zeroEpochs: number;
            readingsUsed: number;
            /** @description Readings counted although flagged outside-linear-range: real stress, but the S-N approach assumes elastic stress ranges, so many of them make the estimate doubtful */
            readingsOutsideLinearRange: number;
            /** @description Faulty readings left out: beyond the gauge's rated range, or found faulty by sensor health (jump or spike, flat line, raw value out of range, or held after a jump until an engineer resolves it) */
            readingsSkipped: number;
            /** @description Width of the range bins, MPa */
            rangeBinWidth: number;
            /** @description Damage per Julian year over the time covered by data; null when no time is covered */
            damageRatePerYear: number | null;
            /** @description Years for that rate to reach D = 1; null when the rate is 0 (no damaging cycles) or unknown */
            yearsToDamageOne: number | null;
        };
        GaugeInput: {
            tag: string;
            label?: string;
            member?: string;
            /** @enum {string} */
            kind: "foil" | "vibrating-wire";
            /** @enum {string} */
            input: "microstrain" | "mV/V" | "Hz" | "frequency-squared";
            bridge?: ("quarter" | "half-bending" | "half-poisson" | "full-bending" | "full-poisson" | "full-axial-poisson") | null;
            /** @description Foil: gauge factor GF. Vibrating wire: the wire gauge factor, µε per unit of f²/1000 */
            gaugeFactor: number;
            loggerGaugeFactor?: number | null;
            /** @description Vibrating wire: multiplier from the gauge's calibration record (default 1) */
            calibrationFactor?: number | null;
            /** @default 1 */
            polarity?: 1 | -1;
            /** @description Quarter bridge: 2-wire (both leads in the gauge's arm) or 3-wire (one); null when not recorded */
            wiring?: ("2-wire" | "3-wire") | null;
            /** @description Ω: with wiring given, the resistance of one lead; without it, the resistance in series with the gauge in its arm */
            leadResistance?: number | null;
            /** @description Ω */
            gaugeResistance?: number | null;
            /** @description Bridge excitation, V; null when not recorded */
            excitationVoltage?: number | null;
            thermal?: ({
                /** @constant */
                method: "none";
            } | {
                /** @constant */
                method: "polynomial";
                coefficients: number[];
            } | {
                /** @constant */
                method: "cte";
                /** @description µε/°C */
                gaugeCte?: number | null;
            }) | null;
            material: {
                name?: string;
                /** @description Young's modulus, MPa */
                E: number;
                nu: number;
                alpha: number;
                /** @description Yield or proportional limit, MPa */
                yield?: number | null;
                /** @description Concrete: characteristic cylinder strength f_ck (or specified f'c), MPa; utilisation is then compressive stress ÷ this, and tension is not rated */
                compressiveStrength?: number | null;
            };
            /**
             * @description MPa
             * @default 0
             */
            initialStress?: number;
            zero: {
                /** @description Raw reading in the gauge's input unit */
                value: number;
                /** @description °C */
                temperature?: number | null;
                /** Format: date-time */
                time?: string;
            };
            /** @description Seconds between readings, for stale-data detection */
            expectedInterval?: number | null;
            /** @description µε either side of zero the gauge is rated for */
            ratedRange?: number | null;
            /** @description Fatigue detail category Δσ_C, MPa at 2×10⁶ cycles; null when not assessed */
            detailCategory?: (160 | 140 | 125 | 112 | 100 | 90 | 80 | 71 | 63 | 56 | 50 | 45 | 40 | 36) | null;
            /** @description Static: readings one at a time. Dynamic: bursts at a fixed rate, summarised on arrival */
            sampling?: {
                /** @constant */
                mode: "static";
            } | {
                /** @constant */
                mode: "dynamic";
                /** @description Samples per second of every burst */
                rateHz: number;
                /**
                 * @description Minutes per summary interval, aligned to the hour
                 * @default 10
                 * @enum {number}
                 */
                summaryMinutes?: 1 | 2 | 3 | 4 | 5 | 6 | 10 | 12 | 15 | 20 | 30 | 60;
                /**
                 * @description Width of the rainflow range bins, MPa
                 * @default 1
                 */
                rangeBin?: number;
                trigger?: {
                    /** @description MPa: a sample above starts an event */
                    above?: number | null;
                    /** @description MPa: a sample below starts an event */
                    below?: number | null;
                    /**
                     * @description s
                     * @default 2
                     */
                    preSeconds?: number;
                    /**
                     * @description s
                     * @default 5
                     */
                    postSeconds?: number;
                } | null;
            };
        };
        GaugeList: {
            gauges: components["schemas"]["Gauge"][];
        };
        GaugePatch: {
            label?: string;
            member?: string;
            /** @enum {string} */
            kind?: "foil" | "vibrating-wire";
            /** @enum {string} */
            input?: "microstrain" | "mV/V" | "Hz" | "frequency-squared";
            bridge?: ("quarter" | "half-bending" | "half-poisson" | "full-bending" | "full-poisson" | "full-axial-poisson") | null;
            /** @description Foil: gauge factor GF. Vibrating wire: the wire gauge factor, µε per unit of f²/1000 */
            gaugeFactor?: number;
            loggerGaugeFactor?: number | null;
            /** @description Vibrating wire: multiplier from the gauge's calibration record (default 1) */
            calibrationFactor?: number | null;
            /** @default 1 */
            polarity?: 1 | -1;
            /** @description Quarter bridge: 2-wire (both leads in the gauge's arm) or 3-wire (one); null when not recorded */
            wiring?: ("2-wire" | "3-wire") | null;
            /** @description Ω: with wiring given, the resistance of one lead; without it, the resistance in series with the gauge in its arm */
            leadResistance?: number | null;
            /** @description Ω */
            gaugeResistance?: number | null;
            /** @description Bridge excitation, V; null when not recorded */
            excitationVoltage?: number | null;
            thermal?: ({
                /** @constant */
                method: "none";
            } | {
                /** @constant */
                method: "polynomial";
                coefficients: number[];
            } | {
                /** @constant */
                method: "cte";
                /** @description µε/°C */
                gaugeCte?: number | null;
            }) | null;
            material?: {
                name?: string;
                /** @description Young's modulus, MPa */
                E: number;
                nu: number;
                alpha: number;
                /** @description Yield or proportional limit, MPa */
                yield?: number | null;
                /** @description Concrete: characteristic cylinder strength f_ck (or specified f'c), MPa; utilisation is then compressive stress ÷ this, and tension is not rated */
                compressiveStrength?: number | null;
            };
            /**
             * @description MPa
             * @default 0
             */
            initialStress?: number;
            zero?: {
                /** @description Raw reading in the gauge's input unit */
                value: number;
                /** @description °C */
                temperature?: number | null;
                /** Format: date-time */
                time?: string;
            };
            /** @description Seconds between readings, for stale-data detection */
            expectedInterval?: number | null;
            /** @description µε either side of zero the gauge is rated for */
            ratedRange?: number | null;
            /** @description Fatigue detail category Δσ_C, MPa at 2×10⁶ cycles; null when not assessed */
            detailCategory?: (160 | 140 | 125 | 112 | 100 | 90 | 80 | 71 | 63 | 56 | 50 | 45 | 40 | 36) | null;
            /** @description Static: readings one at a time. Dynamic: bursts at a fixed rate, summarised on arrival */
            sampling?: {
                /** @constant */
                mode: "static";
            } | {
                /** @constant */
                mode: "dynamic";
                /** @description Samples per second of every burst */
                rateHz: number;
                /**
                 * @description Minutes per summary interval, aligned to the hour
                 * @default 10
                 * @enum {number}
                 */
                summaryMinutes?: 1 | 2 | 3 | 4 | 5 | 6 | 10 | 12 | 15 | 20 | 30 | 60;
                /**
                 * @description Width of the rainflow range bins, MPa
                 * @default 1
                 */
                rangeBin?: number;
                trigger?: {
                    /** @description MPa: a sample above starts an event */
                    above?: number | null;
                    /** @description MPa: a sample below starts an event */
                    below?: number | null;
                    /**
                     * @description s
                     * @default 2
                     */
                    preSeconds?: number;
                    /**
                     * @description s
                     * @default 5
                     */
                    postSeconds?: number;
                } | null;
            };
            reason?: string;
        };
        IngestResult: {
            /** @description Readings stored by this request */
            accepted: number;
            /** @description Readings whose (gauge, time) was already stored, or repeated in the request */
            duplicates: number;
            rejected: {
                /** @description Position in `readings`, or the CSV data row counted from 0 */
                index: number;
                code: string;
                message: string;
            }[];
            alerts: {
                opened: number;
                escalated: number;
                cleared: number;
            };
        };
        Limits: {
            limits: {
                /** @enum {string} */
                quantity: "stress" | "strain" | "utilisation" | "residual";
                /** @enum {string} */
                level: "watch" | "warning" | "critical";
                upper?: number;
                lower?: number;
                hysteresis: number;
                persistence: number;
            }[];
        };
        LimitsInput: {
            limits: {
                /** @enum {string} */
                quantity: "stress" | "strain" | "utilisation" | "residual";
                /** @enum {string} */
                level: "watch" | "warning" | "critical";
                /** @description MPa for stress, µε for strain, a fraction of yield for utilisation */
                upper?: number;
                lower?: number;
                /** @description Dead band a value must come back inside the bound by to clear; same unit */
                hysteresis?: number;
                /** @description Consecutive readings needed to open or clear; default 1 */
                persistence?: number;
            }[];
        };
        LoadTestGauge: {
            gauge: string;
            label: string | null;
            member: string | null;
            /**
             * @description `readings`: the stored readings in the window; `summaries`: a dynamic gauge's interval summaries overlapping the window (their extremes, converted from stress by ε = (σ − σ₀)/E), so the peak is known to the interval
             * @enum {string}
             */
            source: "readings" | "summaries";
            /** @description Predicted peak strain, µε */
            predicted: number;
            /**
             * @description The sign of the prediction, in which the peak is sought
             * @enum {string}
             */
            direction: "tension" | "compression";
            /**
             * @description `measured`; `no-data`: no believed reading (or summary) in the window; `no-baseline`: nothing before the window to measure from
             * @enum {string}
             */
            state: "measured" | "no-data" | "no-baseline";
            /** @description The state in words */
            message: string;
            /** @description Last reading (or summary mean) before the window start, µε: the value the load is measured from */
            baseline: {
                time: string;
                strain: number;
            } | null;
            /** @description Largest change from the baseline in the predicted sign, µε (0 when the gauge never moved that way); null unless measured */
            measured: number | null;
            /** @description Where the peak lies: a reading's instant (start = end) or a summary interval */
            peakAt: {
                start: string;
                end: string;
            } | null;
            /** @description Largest change against the predicted sign, µε (0 when none) */
            against: number | null;
            /** @description measured ÷ predicted; null unless measured */
            ratio: number | null;
            /** @description Readings (or summary intervals) in the window that were used */
            readings: number;
        };
        LoadTestInput: {
            title: string;
            /** @description What loaded the structure, where and when (e.g. two 32 t trucks side by side at midspan) */
            load: string;
            /**
             * Format: date-time
             * @description Start of the test window, ISO-8601 with Z or an offset; the baseline is the last value before it
             */
            start: string;
            /**
             * Format: date-time
             * @description End of the window, excluded; after start, at most 7 days later
             */
            end: string;
            /** @description Predicted peak strain per gauge; give this or `predictedCsv` */
            predicted?: components["schemas"]["PredictedStrain"][];
            /** @description The same table as CSV text: a header naming `gauge` (or `tag`) and `predicted` (a unit in brackets allowed), or two columns without a header */
            predictedCsv?: string;
        };
        LoadTestList: {
            /** @description Newest window first */
            loadTests: components["schemas"]["LoadTestSummary"][];
        };
        LoadTestResults: {
            id: number;
            title: string;
            /** @description What loaded the structure */
            load: string;
            start: string;
            /** @description End of the window, excluded */
            end: string;
            createdAt: string;
            /** @description Who recorded the test */
            createdBy: string;
            structure: string;
            /**
             * @description Whether every gauge, some, or none had data to measure in the window
             * @enum {string}
             */
            dataState: "complete" | "partial" | "none";
            /** @description By gauge tag */
            gauges: components["schemas"]["LoadTestGauge"][];
            caution: string;
        };
        LoadTestSummary: {
            id: number;
            title: string;
            /** @description What loaded the structure */
            load: string;
            start: string;
            /** @description End of the window, excluded */
            end: string;
            /** @description Gauges with a predicted strain */
            gauges: number;
            createdAt: string;
            /** @description Who recorded the test */
            createdBy: string;
        };
        PhotoList: {
            photos: components["schemas"]["File"][];
        };
        PlacementInput: {
            /** @description A drawing of the gauge's structure */
            drawingId: number;
            /** @description From the left edge, 0–1 */
            x: number;
            /** @description From the top edge, 0–1 */
            y: number;
        } | {
            /** @description null takes the gauge off its drawing */
            drawingId: null;
        };
        PredictedStrain: {
            /** @description Gauge tag */
            gauge: string;
            /** @description Predicted peak change of stress-producing strain under the load, µε, tension positive; not 0 */
            predicted: number;
        };
        ReadingsInput: {
            /** @description At most 50 000 readings (and 10 MB) per request; more is a 413. */
            readings: unknown[];
        };
        ReadingsPage: {
            readings: {
                time: string;
                value: number;
                temperature: number | null;
                strain: number;
                stress: number;
                /** @description Words, each once: from the conversion `outside-linear-range` (stress near yield or strain past the gauge's rated range) and `out-of-range` (past the rated range); from sensor health `spike` (a lone reading far from both neighbours, set aside on its own; the newest reading stays a spike until the next one shows whether it was a jump), `jump` (a change of level that stayed), `after-jump` (held after an unresolved jump), `flat-line`, `out-of-range` (raw value outside the sensor's range). Readings with a sensor-health word are left out of limits, extremes, reports and fatigue. */
                flags: string[];
            }[];
            nextCursor?: string;
        };
        ResolveFaultInput: {
            /**
             * @description accept-step: the quarantined readings are checked against the limits from the jump on; new-zero: the reading at the jump becomes the gauge's zero and the readings between stay set aside
             * @enum {string}
             */
            resolution: "accept-step" | "new-zero";
            comment: string;
        };
        Rosette: {
            tag: string;
            /** @enum {string} */
            layout: "rectangular" | "delta";
            gauges: string[];
            createdAt: string;
        };
        RosetteBacktestInput: {
            limits: {
                /** @enum {string} */
                quantity: "sigma1" | "sigma2" | "vonMises";
                /** @enum {string} */
                level: "watch" | "warning" | "critical";
                /** @description MPa (sigma1, sigma2 and vonMises are all stresses) */
                upper?: number;
                lower?: number;
                /** @description Dead band a value must come back inside the bound by to clear; same unit */
                hysteresis?: number;
                /** @description Consecutive readings needed to open or clear; default 1 */
                persistence?: number;
            }[];
            /** Format: date-time */
            from: string;
            /** Format: date-time */
            to: string;
        };
        RosetteInput: {
            tag: string;
            /** @enum {string} */
            layout: "rectangular" | "delta";
            gauges: [
                string,
                string,
                string
            ];
        };
        RosetteLimits: {
            limits: {
                /** @enum {string} */
                quantity: "sigma1" | "sigma2" | "vonMises";
                /** @enum {string} */
                level: "watch" | "warning" | "critical";
                upper?: number;
                lower?: number;
                hysteresis: number;
                persistence: number;
            }[];
        };
        RosetteLimitsInput: {
            limits: {
                /** @enum {string} */
                quantity: "sigma1" | "sigma2" | "vonMises";
                /** @enum {string} */
                level: "watch" | "warning" | "critical";
                /** @description MPa (sigma1, sigma2 and vonMises are all stresses) */
                upper?: number;
                lower?: number;
                /** @description Dead band a value must come back inside the bound by to clear; same unit */
                hysteresis?: number;
                /** @description Consecutive readings needed to open or clear; default 1 */
                persistence?: number;
            }[];
        };
        RosetteList: {
            rosettes: components["schemas"]["Rosette"][];
        };
        Series: {
            /** @enum {string} */
            quantity: "strain" | "stress" | "temperature" | "residual";
            unit: string;
            from: string;
            to: string;
            /** @description Bucket width, ms */
            bucketWidth: number;
            /**
             * @description What the buckets were built from
             * @enum {string}
             */
            source: "raw" | "hourly" | "daily";
            /** @description Bucket starts, epoch ms; empty buckets are left out */
            t: number[];
            min: number[];
            max: number[];
            mean: number[];
            count: number[];
        };
        ShuntCheck: {
            id: number;
            /** @description When the shunt was applied, UTC */
            time: string;
            /** @description Ω across the gauge */
            shuntResistance: number;
            /** @description Change of the logger's reading with the shunt applied, in `unit` */
            measuredOutput: number;
            /** @description What the bridge should show, in `unit`: the Wheatstone circuit with the shunted gauge arm at ΔR/R = −R_g²/((R_g + R_s)·(R_g + R_L)), from the gauge's configuration when the check was recorded */
            expectedOutput: number;
            /** @description The gauge's input unit at the time: mV/V or microstrain */
            unit: string;
            /** @description µε the shunt simulates, as the gauge's conversion reads the expected output */
            simulatedStrain: number;
            /** @description (measured − expected) ÷ expected, % */
            differencePercent: number;
            /** @description Pass band, % of the expected output */
            tolerancePercent: number;
            /** @description Whether |difference| is within the tolerance */
            passed: boolean;
            /** @description Who recorded it */
            checkedBy: string;
            note: string | null;
        };
        ShuntCheckInput: {
            /** @description Ω of the resistor placed across the gauge */
            shuntResistance: number;
            /** @description Change of the logger's reading when the shunt was applied, in the gauge's input unit (mV/V, or µε for a logger that reports microstrain) */
            measuredOutput: number;
            /**
             * @description Pass band, % of the expected output (default 1, common practice)
             * @default 1
             */
            tolerancePercent?: number;
            /**
             * Format: date-time
             * @description When the shunt was applied; default now
             */
            time?: string;
            note?: string;
        };
        ShuntCheckList: {
            /** @description Newest first */
            shuntChecks: components["schemas"]["ShuntCheck"][];
        };
        SiteVisit: {
            id: number;
            /** @description UTC, ISO-8601 with milliseconds */
            visitedAt: string;
            /** @description Who went */
            visitor: string;
            /** @description What was done */
            work: string;
            /** @description Tags of the gauges the visit touched */
            gauges: string[];
            photos: components["schemas"]["File"][];
            createdBy: string;
            createdAt: string;
        };
        SiteVisitInput: {
            /**
             * Format: date-time
             * @description When the visit began, ISO-8601 with Z or an offset; not in the future
             */
            visitedAt: string;
            /** @description Who went (names of the crew); default the person whose token or session sends it */
            visitor?: string;
            work: string;
            /**
             * @description Tags of the structure's gauges the visit touched
             * @default []
             */
            gauges?: string[];
        };
        SiteVisitPage: {
            /** @description Newest visit first */
            visits: components["schemas"]["SiteVisit"][];
            /** @description Visits that match in all */
            total: number;
            page: number;
            perPage: number;
        };
        Structure: {
            code: string;
            name: string;
            location: string | null;
            /** @description IANA time zone */
            timezone: string;
            description: string | null;
            /** @description UTC, ISO-8601 with milliseconds */
            createdAt: string;
        };
        StructureDetail: {
            code: string;
            name: string;
            location: string | null;
            /** @description IANA time zone */
            timezone: string;
            description: string | null;
            /** @description UTC, ISO-8601 with milliseconds */
            createdAt: string;
            /** @description The structure's gauges, each with every gauge field and its condition now */
            gauges: ({
                condition: components["schemas"]["GaugeCondition"];
            } & {
                [key: string]: unknown;
            })[];
            openAlerts: number;
        };
        StructureInput: {
            /**
             * @description Short unique code, 2–32 of A-Z a-z 0-9 - _
             * @example FB-01
             */
            code: string;
            name: string;
            location?: string;
            /**
             * @description IANA time zone, default UTC
             * @default UTC
             */
            timezone?: string;
            description?: string;
        };
        StructureList: {
            structures: components["schemas"]["Structure"][];
        };
        StructureReport: {
            structure: {
                code: string;
                name: string;
                location: string | null;
                timezone: string;
            };
            period: {
                /** @description Start, included: the structure's local midnight beginning the first day, as a UTC instant */
                from: string;
                /** @description End, excluded: the structure's local midnight after the last day, as a UTC instant */
                to: string;
                /** @description First day included, YYYY-MM-DD in the structure's time zone */
                firstDay: string;
                /** @description Last day included, YYYY-MM-DD in the structure's time zone */
                lastDay: string;
                /** @description e.g. "November 2026" */
                name: string;
                /** @description "2026-11" for a month, else "<first day>_<last day>" */
                key: string;
            };
            generatedAt: string;
            summary: {
                /**
                 * @description Worst limit-alert level open in the period; all-clear; or no-data when no reading arrived
                 * @enum {string}
                 */
                level: "critical" | "warning" | "watch" | "all-clear" | "no-data";
                headline: string;
                /** @description Alerts open at any time in the period, limit alerts by level, sensor alerts apart */
                alerts: {
                    watch: number;
                    warning: number;
                    critical: number;
                    sensor: number;
                };
                readings: {
                    received: number;
                    /** @description Whole expected intervals in the part of the period the gauge was installed and not retired (and not after now) */
                    expected: number;
                    /** @description received ÷ expected as a ratio (1 = 100 %), never above 1; null when nothing was expected */
                    completeness: number | null;
                    /** @description Readings received beyond those expected: more than a few mean the registered expected interval is longer than the logger's */
                    surplus: number;
                };
                /** @description How the structure stands now, when the report is made */
                current: {
                    /**
                     * @description The worst condition of the structure's active gauges now
                     * @enum {string}
                     */
                    state: "critical" | "warning" | "watch" | "sensor-fault" | "no-data" | "within-limits" | "no-limits";
                    stale: boolean;
                    lastReadingAt: string | null;
                };
            };
            /** @description Gauges installed at some time in the period, by tag */
            gauges: {
                tag: string;
                label: string | null;
                member: string | null;
                /** @enum {string} */
                status: "active" | "retired";
                /** @description Seconds between readings the logger should send */
                expectedIntervalS: number;
                /** @description Part of the period in which the gauge was installed, not retired, and not in the future */
                activeSpan: {
                    from: string;
                    to: string;
                } | null;
                readings: {
                    received: number;
                    /** @description Whole expected intervals in the part of the period the gauge was installed and not retired (and not after now) */
                    expected: number;
                    /** @description received ÷ expected as a ratio (1 = 100 %), never above 1; null when nothing was expected */
                    completeness: number | null;
                    /** @description Readings received beyond those expected: more than a few mean the registered expected interval is longer than the logger's */
                    surplus: number;
                };
                /** @description The gauge's condition when the report is made */
                condition: components["schemas"]["GaugeCondition"];
                /** @description Readings left out of the extremes and the utilisation peak because the sensor was in fault when they were taken (an open jump, flat-line or out-of-range alert) or they lie beyond the gauge's rated range; null when none */
                leftOut: {
                    readings: number;
                    reason: string;
                } | null;
                /** @description Lowest and highest stress of the period, MPa, of the readings believed (see leftOut); null without such readings */
                stress: {
                    min: number;
                    max: number;
                    /** @constant */
                    unit: "MPa";
                } | null;
                /** @description Lowest and highest stress-producing strain of the period, µε, of the readings believed (see leftOut); null without such readings */
                strain: {
                    min: number;
                    max: number;
                    /** @constant */
                    unit: "µε";
                } | null;
                /** @description Lowest and highest temperature of the period, °C, of the readings believed (see leftOut); null without such readings */
                temperature: {
                    min: number;
                    max: number;
                    /** @constant */
                    unit: "°C";
                } | null;
                /** @description null when the gauge's material has neither a yield nor a compressive strength, or there were no readings */
                utilisationPeak: ({
                    /** @constant */
                    basis: "yield";
                    /** @description max |σ| ÷ yield over the period (1 = at yield) */
                    ratio: number;
                    /** @description Yield stress, MPa */
                    yield: number;
                } | {
                    /** @constant */
                    basis: "compressive-strength";
                    /** @description Concrete: largest compressive stress ÷ f_ck over the period (1 = at f_ck); null when it was only in tension, which is not rated */
                    ratio: number | null;
                    /** @description Characteristic compressive strength f_ck, MPa */
                    compressiveStrength: number;
                }) | null;
                gaps: {
                    /** @description Runs of whole hours without readings (longer than the expected interval), oldest first, at most 10; start and end UTC */
                    list: {
                        start: string;
                        end: string;
                        hours: number;
                    }[];
                    /** @description Runs not listed */
                    more: number;
                    /** @description Hours in all runs, listed or not */
                    totalHours: number;
                };
                /** @description Fatigue damage of the period, as GET …/gauges/{tag}/fatigue computes it with the gauge's category */
                fatigue: {
                    /** @constant */
                    status: "assessed";
                    /** @description Detail category Δσ_C, MPa at 2×10⁶ cycles */
                    category: number;
                    /** @description Palmgren–Miner sum of the period */
                    damage: number;
                    cyclesCounted: number;
                    readingsUsed: number;
                } | {
                    /**
                     * @description The gauge has no detail category
                     * @constant
                     */
                    status: "not-assessed";
                };
                /** @description Stress over the period in MPa, min, max and mean per interval, as GET …/gauges/{tag}/series answers it; null when nothing was stored */
                stressSeries: {
                    /** @description Start of each interval, epoch ms; intervals without readings are left out */
                    t: number[];
                    min: number[];
                    max: number[];
                    mean: number[];
                    /** @description Width of the intervals, ms */
                    bucketWidth: number;
                } | null;
                /** @description The gauge's stress bounds, and its utilisation bounds at bound × yield stress, as lines across the stress chart */
                stressLimitLines: {
                    /** @description MPa */
                    value: number;
                    /** @enum {string} */
                    level: "watch" | "warning" | "critical";
                    text: string;
                }[];
                /** @description Where the gauge sits on one of the structure's drawings: x across and y down, as fractions of the drawing's width and height */
                placement: {
                    drawing: number;
                    x: number;
                    y: number;
                } | null;
            }[];
            /** @description Alerts open at any time in the period, newest first */
            alerts: {
                id: number;
                gauge: string;
                /** @enum {string} */
                kind: "limit" | "sensor";
                /** @enum {string} */
                level: "watch" | "warning" | "critical";
                quantity: string | null;
                code: string | null;
                message: string | null;
                /** @description Unit of bound and peak: MPa, µε, or ratio (utilisation, 1 = at yield); null for sensor alerts */
                unit: string | null;
                bound: number | null;
                peak: number | null;
                openedAt: string;
                /** @description Opened earlier and still open when the period began */
                openedBeforePeriod: boolean;
                clearedAt: string | null;
                acknowledged: {
                    at: string;
                    by: string | null;
                    comment: string | null;
                } | null;
                /** @description The alert's whole history up to when the report was made, oldest first */
                events: {
                    /** @description opened, escalated, cleared, acknowledged or note */
                    type: string;
                    at: string;
                    level: string | null;
                    by: string | null;
                    text: string | null;
                }[];
            }[];
            /** @description The structure's drawings, oldest first; the gauges' placements point into them */
            drawings: {
                id: number;
                title: string;
                contentType: string;
                /** @description Pixels */
                width: number | null;
                /** @description Pixels */
                height: number | null;
                /** @description Where the image's bytes are served */
                url: string;
            }[];
            /** @description Load tests whose window overlaps the period, oldest first, with their results */
            loadTests: components["schemas"]["LoadTestResults"][];
            /** @description Shunt-calibration checks recorded in the period, oldest first */
            shuntChecks?: {
                gauge: string;
                time: string;
                /** @description Output the shunt should give, in unit */
                expectedOutput: number;
                measuredOutput: number;
                /** @description Unit of the outputs: the gauge's input (mV/V, µε, …) */
                unit: string;
                /** @description (measured − expected) ÷ expected, % */
                differencePercent: number;
                tolerancePercent: number;
                passed: boolean;
            }[];
            /** @description Calibration certificates that expired in the period or expire within the reminder window (CERTIFICATE_REMINDER_DAYS, largest) after its last day, soonest first */
            certificates?: {
                gauge: string | null;
                logger: string | null;
                number: string;
                /** @description Last day of validity, YYYY-MM-DD */
                expiresOn: string;
                /** @description true: expired by the period's end; false: expires within the reminder window after it */
                expiredInPeriod: boolean;
            }[];
            /** @description The thermal model in force of each gauge in the report that has one, by tag */
            thermalModels?: {
                gauge: string;
                /** @description µε/°C */
                slope: number;
                lagMinutes: number;
                r2: number;
                /** @description σ of the fit's residuals, µε */
                residualStd: number;
                /** @description Lowest and highest thermal residual of the period's readings not found faulty; null when none has a residual */
                residual: {
                    min: number;
                    max: number;
                    /** @constant */
                    unit: "µε";
                } | null;
            }[];
            cautions: string[];
        };
        ThermalFitPreview: {
            /** @description a, µε: the model strain at 0 °C (and the drift origin) */
            intercept: number;
            /** @description b, µε/°C: stress-producing strain per degree of the lagged temperature */
            slope: number;
            /** @description The lag used, minutes: the model reads the temperature that long before each reading */
            lagMinutes: number;
            /** @description c, µε/day from the start of the reference period; present only when drift was fitted */
            drift?: number;
            /** @description Coefficient of determination of the fit, 0–1 */
            r2: number;
            /** @description σ of the residual over the reference period, µε: √(SSres / (n − p)) */
            residualStd: number;
            /** @description Readings the fit used (healthy, with a known lagged temperature) */
            readings: number;
            /** @description Lagged temperature range of the reference period, °C: the model is a statistical fit valid inside it */
            temperatureRange: {
                min: number;
                max: number;
            };
            /** @description The fitted readings (at most 2 000, evenly thinned) for a scatter against the fitted line */
            scatter: {
                /** @description Lagged temperature, °C */
                temperature: number;
                /** @description Stress-producing strain, µε */
                strain: number;
            }[];
        };
        ThermalModel: {
            /** @description a, µε: the model strain at 0 °C (and the drift origin) */
            intercept: number;
            /** @description b, µε/°C: stress-producing strain per degree of the lagged temperature */
            slope: number;
            /** @description The lag used, minutes: the model reads the temperature that long before each reading */
            lagMinutes: number;
            /** @description c, µε/day from the start of the reference period; present only when drift was fitted */
            drift?: number;
            /** @description Coefficient of determination of the fit, 0–1 */
            r2: number;
            /** @description σ of the residual over the reference period, µε: √(SSres / (n − p)) */
            residualStd: number;
            /** @description Readings the fit used (healthy, with a known lagged temperature) */
            readings: number;
            /** @description Lagged temperature range of the reference period, °C: the model is a statistical fit valid inside it */
            temperatureRange: {
                min: number;
                max: number;
            };
            /** @description Start of the reference period */
            from: string;
            /** @description End of the reference period (included) */
            to: string;
            /**
             * @description Whether the lag was given or searched for by best fit
             * @enum {string}
             */
            lagSearch: "fixed" | "auto";
            /** @description The search bound asked for with lagSearch auto */
            maxLagMinutes?: number;
            /** @description Who saved the model */
            fittedBy: string;
            fittedAt: string;
        };
        ThermalModelInput: {
            /**
             * Format: date-time
             * @description Start of the reference period, ISO-8601 with Z or an offset
             */
            from: string;
            /**
             * Format: date-time
             * @description End of the reference period (included)
             */
            to: string;
            /**
             * @description Minutes the member's temperature lags the measured one (default 0), or "auto": the lag that fits best
             * @default 0
             */
            lagMinutes?: number | "auto";
            /** @description With "auto": how far back to search, minutes; default the lesser of 1440 and half the period. Longer than the period is refused. */
            maxLagMinutes?: number;
            /**
             * @description Fit a linear drift term in µε/day as well
             * @default false
             */
            drift?: boolean;
        };
        ZeroInput: {
            fromReadings: number;
            reason?: string;
        } | {
            /** @description Raw reading in the gauge's input unit */
            value: number;
            /** @description °C */
            temperature?: number | null;
            /** Format: date-time */
            time?: string;
            reason?: string;
        };
    };
    responses: never;
    parameters: never;
    requestBodies: never;
    headers: never;
    pathItems: never;
}
export type $defs = Record<string, never>;
export interface operations {
    getStructures: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The structures */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["StructureList"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructures: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["StructureInput"];
            };
        };
        responses: {
            /** @description The new structure */
            201: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Structure"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Conflict with what is stored */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCode: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The structure */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["StructureDetail"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeGauges: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The gauges */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["GaugeList"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeGauges: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["GaugeInput"];
            };
        };
        responses: {
            /** @description The new gauge */
            201: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Gauge"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Conflict with what is stored */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeGaugesByTag: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The gauge */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Gauge"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    deleteStructuresByCodeGaugesByTag: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The retired gauge */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Gauge"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    patchStructuresByCodeGaugesByTag: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["GaugePatch"];
            };
        };
        responses: {
            /** @description The gauge */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Gauge"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Conflict with what is stored */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeGaugesByTagZero: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["ZeroInput"];
            };
        };
        responses: {
            /** @description The gauge with its new zero */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Gauge"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Conflict with what is stored */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeGaugesByTagShuntChecks: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The checks */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ShuntCheckList"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeGaugesByTagShuntChecks: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["ShuntCheckInput"];
            };
        };
        responses: {
            /** @description The check with its expected output and verdict */
            201: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ShuntCheck"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Conflict with what is stored */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeGaugesByTagLimits: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The limits, with defaults applied */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Limits"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    putStructuresByCodeGaugesByTagLimits: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["LimitsInput"];
            };
        };
        responses: {
            /** @description The limits now in force */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Limits"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeGaugesByTagLimitsBacktest: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["BacktestInput"];
            };
        };
        responses: {
            /** @description The alert episodes the limits would have raised */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Backtest"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeGaugesByTagThermalModel: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The model; 404 when the gauge has none */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ThermalModel"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    putStructuresByCodeGaugesByTagThermalModel: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["ThermalModelInput"];
            };
        };
        responses: {
            /** @description The model now in force */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ThermalModel"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    deleteStructuresByCodeGaugesByTagThermalModel: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Removed */
            204: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Conflict with what is stored */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeGaugesByTagThermalModelFit: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["ThermalModelInput"];
            };
        };
        responses: {
            /** @description The fitted coefficients and the points fitted */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ThermalFitPreview"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeRosettes: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The rosettes */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["RosetteList"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeRosettes: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["RosetteInput"];
            };
        };
        responses: {
            /** @description The rosette */
            201: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Rosette"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Conflict with what is stored */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeRosettesByTagLimits: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Rosette tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The limits, with defaults applied */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["RosetteLimits"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    putStructuresByCodeRosettesByTagLimits: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Rosette tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["RosetteLimitsInput"];
            };
        };
        responses: {
            /** @description The limits now in force */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["RosetteLimits"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeRosettesByTagLimitsBacktest: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Rosette tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["RosetteBacktestInput"];
            };
        };
        responses: {
            /** @description The alert episodes the limits would have raised */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Backtest"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeRosettesByTagSeries: {
        parameters: {
            query?: {
                /** @description ISO-8601 with Z or an offset; default 7 days before `to` */
                from?: string;
                /** @description ISO-8601 with Z or an offset, exclusive; default now (or 7 days after `from`) */
                to?: string;
                /** @description Most buckets, 1–5000 (default 1000) */
                points?: string;
                /** @description sigma1 | sigma2 | vonMises | tauMax | theta; default vonMises */
                quantity?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Rosette tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The buckets */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Series"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeAlerts: {
        parameters: {
            query?: {
                /** @description open (default: open and not acknowledged), acknowledged, cleared or all */
                state?: string;
                /** @description watch, warning, critical, or any (default) */
                level?: string;
                /** @description limit, sensor, or any (default) */
                kind?: string;
                /** @description Alerts per page, 1–1000 (default 500); `total` says how many match in all */
                limit?: string;
                /** @description `nextCursor` of the previous page; absent for the first page */
                cursor?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The alerts */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["AlertList"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postAlertsByIdAcknowledge: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Alert id */
                id: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["AcknowledgeInput"];
            };
        };
        responses: {
            /** @description The alert */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Alert"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postAlertsByIdResolve: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Alert id */
                id: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["ResolveFaultInput"];
            };
        };
        responses: {
            /** @description The alert, cleared */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Alert"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Conflict with what is stored */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeDrawings: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The drawings, oldest first */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["DrawingList"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeDrawings: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "multipart/form-data": {
                    /**
                     * Format: binary
                     * @description PNG, JPEG or WebP image, at most 20 MB. The type is read from the content, not the name.
                     */
                    file: string;
                    /** @description What the drawing shows, e.g. North elevation */
                    title: string;
                };
            };
        };
        responses: {
            /** @description The stored drawing */
            201: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["File"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeGaugesByTagPhotos: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The photos, oldest first */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["PhotoList"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeGaugesByTagPhotos: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "multipart/form-data": {
                    /**
                     * Format: binary
                     * @description PNG, JPEG or WebP image, at most 10 MB. The type is read from the content, not the name.
                     */
                    file: string;
                    /** @description Caption; defaults to "Installation photo of {tag}" */
                    title?: string;
                };
            };
        };
        responses: {
            /** @description The stored photo */
            201: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["File"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    putStructuresByCodeGaugesByTagPlacement: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["PlacementInput"];
            };
        };
        responses: {
            /** @description The gauge */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Gauge"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeGaugesByTagFatigue: {
        parameters: {
            query?: {
                /** @description Start of the period, included; default `to` − 30 days */
                from?: string;
                /** @description End of the period, excluded; default now */
                to?: string;
                /** @description Detail category Δσ_C, MPa at 2×10⁶ cycles; default the gauge's own */
                category?: string;
                /** @description json (default), or csv for the rainflow matrix; Accept: text/csv does the same */
                format?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The fatigue figures of the period */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["GaugeFatigue"];
                    "text/csv": string;
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeReadings: {
        parameters: {
            query?: {
                /** @description CSV only: IANA time zone for times without an offset (default: the structure's time zone) */
                timezone?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["ReadingsInput"];
                "text/csv": string;
            };
        };
        responses: {
            /** @description What was stored, counted as duplicate and rejected */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["IngestResult"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeBursts: {
        parameters: {
            query?: {
                /** @description Binary body only: Gauge tag */
                gauge?: string;
                /** @description Binary body only: First sample's time, ISO-8601 with Z or an offset */
                start?: string;
                /** @description Binary body only: Samples per second: the gauge's rate */
                rateHz?: string;
                /** @description Binary body only: °C for the whole burst, when the gauge's compensation needs it */
                temperature?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["BurstsInput"];
                "application/octet-stream": string;
            };
        };
        responses: {
            /** @description What was stored, counted as duplicate and rejected */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["BurstResult"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeGaugesByTagSummaries: {
        parameters: {
            query?: {
                /** @description ISO-8601 with Z or an offset; default 7 days before `to` */
                from?: string;
                /** @description ISO-8601 with Z or an offset, exclusive; default now (or 7 days after `from`) */
                to?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The intervals */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["BurstSummaries"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeGaugesByTagEvents: {
        parameters: {
            query?: {
                /** @description ISO-8601 with Z or an offset; default 7 days before `to` */
                from?: string;
                /** @description ISO-8601 with Z or an offset, exclusive; default now (or 7 days after `from`) */
                to?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The events */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["EventList"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeEventsById: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Event id */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The event */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["EventDetail"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    patchStructuresByCodeEventsById: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Event id */
                id: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["EventLabelInput"];
            };
        };
        responses: {
            /** @description The event */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["EventDetail"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeUploads: {
        parameters: {
            query?: {
                /** @description CSV only: IANA time zone for times without an offset (default: the structure's time zone) */
                timezone?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "text/csv": string;
            };
        };
        responses: {
            /** @description Progress lines and the final report */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/x-ndjson": string;
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeGaugesByTagReadings: {
        parameters: {
            query?: {
                /** @description ISO-8601 with Z or an offset; default 7 days before `to` */
                from?: string;
                /** @description ISO-8601 with Z or an offset, exclusive; default now (or 7 days after `from`) */
                to?: string;
                /** @description Readings per page, 1–10 000 (default 1000) */
                limit?: string;
                /** @description `nextCursor` of the previous page */
                cursor?: string;
                /** @description CSV only: `names` (default) or `units` */
                header?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description A page of readings */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ReadingsPage"];
                    "text/csv": string;
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeGaugesByTagSeries: {
        parameters: {
            query?: {
                /** @description ISO-8601 with Z or an offset; default 7 days before `to` */
                from?: string;
                /** @description ISO-8601 with Z or an offset, exclusive; default now (or 7 days after `from`) */
                to?: string;
                /** @description Most buckets, 1–5000 (default 1000) */
                points?: string;
                /** @description strain (µε), stress (MPa) or temperature (°C); default strain */
                quantity?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Gauge tag */
                tag: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The buckets */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Series"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeReport: {
        parameters: {
            query?: {
                /** @description A calendar month, YYYY-MM; its days in the structure's time zone. Default (no month, from or to): the previous month in the structure's time zone */
                month?: string;
                /** @description First day included, YYYY-MM-DD (a day in the structure's time zone); with `to`, instead of `month` */
                from?: string;
                /** @description Last day included, YYYY-MM-DD (a day in the structure's time zone) */
                to?: string;
                /** @description json (default), or pdf for the printable report as an attachment; Accept: application/pdf does the same */
                format?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The report */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["StructureReport"];
                    "application/pdf": string;
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeLoadTests: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The load tests */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["LoadTestList"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeLoadTests: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["LoadTestInput"];
            };
        };
        responses: {
            /** @description The test with its results as they stand */
            201: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["LoadTestResults"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeLoadTestsById: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Load test id */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The test and its results */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["LoadTestResults"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeLoadTestsByIdResultsCsv: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Load test id */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The results as text/csv */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "text/csv": string;
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeCertificates: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The certificates */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["CertificateList"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeCertificates: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "multipart/form-data": {
                    /**
                     * Format: binary
                     * @description The certificate: PDF, PNG, JPEG or WebP file, at most 20 MB. The type is read from the content, not the name; a PDF must be whole (end with %%EOF).
                     */
                    file: string;
                    /** @description Tag of the structure's gauge the certificate is for; give this or `logger` */
                    gauge?: string;
                    /** @description Name of the logger the certificate is for (its token's name or serial number); give this or `gauge` */
                    logger?: string;
                    /** @description Certificate number as printed */
                    number: string;
                    /** @description The calibration laboratory */
                    issuedBy: string;
                    /** @description YYYY-MM-DD */
                    issuedOn: string;
                    /** @description YYYY-MM-DD, after issuedOn: the last day the certificate is valid, on the structure's clock */
                    expiresOn: string;
                };
            };
        };
        responses: {
            /** @description The stored certificate */
            201: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["CalibrationCertificate"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeCertificatesByIdFile: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
                /** @description Certificate id */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The file */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/pdf": string;
                    "image/png": string;
                    "image/jpeg": string;
                    "image/webp": string;
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getStructuresByCodeSiteVisits: {
        parameters: {
            query?: {
                /** @description Page of 20 visits, newest first (default 1) */
                page?: string;
                /** @description Only the visits that name this gauge */
                gauge?: string;
            };
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description A page of visits */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["SiteVisitPage"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    postStructuresByCodeSiteVisits: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Structure code */
                code: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "multipart/form-data": {
                    /** @description When the visit began, ISO-8601 with Z or an offset; not in the future */
                    visitedAt: string;
                    /** @description Who went; default the sender */
                    visitor?: string;
                    /** @description What was done */
                    work: string;
                    /** @description A gauge tag the visit touched; repeat the field for each */
                    gauges?: string;
                    /**
                     * Format: binary
                     * @description A photo taken on the visit: PNG, JPEG or WebP image, at most 10 MB. Repeat the field for each, at most 8.
                     */
                    photos?: string;
                };
                "application/json": components["schemas"]["SiteVisitInput"];
            };
        };
        responses: {
            /** @description The stored visit */
            201: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["SiteVisit"];
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Body over the limit */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unsupported content type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    getFilesById: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description File id */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The image */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "image/png": string;
                    "image/jpeg": string;
                    "image/webp": string;
                };
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
    deleteFilesById: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description File id */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Deleted */
            204: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description Malformed or invalid request */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description No token, or an unknown or revoked one */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Authenticated, but the role may not do this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
            /** @description Unknown, or not visible to the caller */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Error"];
                };
            };
        };
    };
}
