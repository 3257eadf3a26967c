-- The bridge relations now put the primary active gauge in R1 (tension gives a positive output) and
-- polarity reverses the bridge output before the relation. The former relations equal the new ones
-- at the opposite output, so flipping the polarity of every gauge read in mV/V converts its raw
-- readings to the strains already stored.
UPDATE `gauges` SET `polarity` = -`polarity` WHERE `input` = 'mV/V';
