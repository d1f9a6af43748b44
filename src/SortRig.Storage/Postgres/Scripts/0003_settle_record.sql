-- SortRig precision log, schema version 3 (PostgreSQL): which settle rule accepted each part, and the predictive fit.
-- accepted_by is NULL for unstable parts and for parts logged before version 3; the fit_ columns are set only when
-- the predictive rule accepted (its recovery fit on the meter's own scale, before any range transfer):
-- model, predicted final value, the fit's and the model misfit's standard uncertainties, the time constants
-- (tau2 only for two exponentials), readings and span fitted, residual RMS, runs-test z (NULL when not finite)
-- and the chosen model's Akaike weight.
ALTER TABLE parts ADD COLUMN accepted_by TEXT CHECK (accepted_by IN ('Averaging', 'Predictive'));
ALTER TABLE parts ADD COLUMN fit_model TEXT CHECK (fit_model IN ('OneExponential', 'TwoExponentials'));
ALTER TABLE parts ADD COLUMN fit_value_ohms DOUBLE PRECISION;
ALTER TABLE parts ADD COLUMN fit_u_fit_ohms DOUBLE PRECISION CHECK (fit_u_fit_ohms >= 0);
ALTER TABLE parts ADD COLUMN fit_u_misfit_ohms DOUBLE PRECISION CHECK (fit_u_misfit_ohms >= 0);
ALTER TABLE parts ADD COLUMN fit_tau1_s DOUBLE PRECISION CHECK (fit_tau1_s > 0);
ALTER TABLE parts ADD COLUMN fit_tau2_s DOUBLE PRECISION CHECK (fit_tau2_s > 0);
ALTER TABLE parts ADD COLUMN fit_readings INTEGER CHECK (fit_readings >= 0);
ALTER TABLE parts ADD COLUMN fit_span_s DOUBLE PRECISION CHECK (fit_span_s >= 0);
ALTER TABLE parts ADD COLUMN fit_rms_ohms DOUBLE PRECISION CHECK (fit_rms_ohms >= 0);
ALTER TABLE parts ADD COLUMN fit_runs_z DOUBLE PRECISION;
ALTER TABLE parts ADD COLUMN fit_weight DOUBLE PRECISION CHECK (fit_weight >= 0);
