# Expected values for test/reference/psych.test.ts.
# Run from this folder:  Rscript make-expected.R
# Needs Debian r-base-core and r-cran-psych.
#
# 1. The within/between statistics that lexichron's validate stage reports for a score x rating
#    pair (analysePair, with the pipeline's own options), on two of psych's example data sets:
#    `withinBetween` (16 rows, 4 groups of 4, built so that within- and between-group
#    correlations differ, even in sign) and `sat.act` (self-reported ACT, SAT verbal and SAT
#    quantitative of 700 people, grouped by education; complete rows only).
#    Writes within-between.csv, sat-act.csv (data) and expected-statsby.csv with, per pair of
#    variables or per variable:
#      rwg            psych::statsBy rwg: pooled within-group correlation (= repeated-measures r)
#      r_group_means  Pearson r of the unweighted group means psych::statsBy reports (one point
#                     per group; statsBy's own rbg weights each mean by its group size, which the
#                     pipeline does not)
#      ICC1_n0        one-way ICC(1) from the mean squares of stats::anova(lm(y ~ group)), with the
#                     average group size n0 = (N - sum(n_i^2)/N)/(g - 1) of Snedecor & Cochran
#                     (Statistical Methods, 10.14) for unbalanced groups (statsBy's ICC1 uses N/g;
#                     the two agree on balanced data, which the script checks on withinBetween)
#      ICC2           psych::statsBy ICC2 = (MSb - MSw)/MSb (no group size involved)
# 2. psych::alpha on R's `attitude` data (Chatterjee & Price 1977; 30 departments x 7 items):
#    writes attitude.csv (data) and expected-alpha.csv (raw_alpha, std.alpha).
suppressPackageStartupMessages(library(psych))

icc1_n0 <- function(y, g) {
  a <- anova(lm(y ~ factor(g)))
  msb <- a[1, "Mean Sq"]; msw <- a[2, "Mean Sq"]
  n <- table(g); N <- sum(n); k <- length(n)
  n0 <- (N - sum(n^2) / N) / (k - 1)
  (msb - msw) / (msb + (n0 - 1) * msw)
}
expected_statsby <- function(data, group, name) {
  sb <- statsBy(data, group = group, cors = TRUE)
  vars <- setdiff(colnames(data), group)
  balanced <- length(unique(table(data[[group]]))) == 1
  rows <- list()
  for (i in seq_along(vars)) for (j in seq_along(vars)) if (i < j) {
    a <- vars[i]; b <- vars[j]
    rows[[length(rows) + 1]] <- data.frame(dataset = name, quantity = "rwg", x = a, y = b, value = sb$rwg[paste0(a, ".wg"), paste0(b, ".wg")])
    rows[[length(rows) + 1]] <- data.frame(dataset = name, quantity = "r_group_means", x = a, y = b, value = cor(sb$mean[, a], sb$mean[, b]))
  }
  for (a in vars) {
    icc1 <- icc1_n0(data[[a]], data[[group]])
    if (balanced) stopifnot(isTRUE(all.equal(icc1, unname(sb$ICC1[[a]]), tolerance = 1e-12)))
    rows[[length(rows) + 1]] <- data.frame(dataset = name, quantity = "ICC1_n0", x = a, y = "", value = icc1)
    rows[[length(rows) + 1]] <- data.frame(dataset = name, quantity = "ICC2", x = a, y = "", value = sb$ICC2[[a]])
  }
  do.call(rbind, rows)
}
data(withinBetween, package = "psych")
wb <- withinBetween
write.csv(wb, "within-between.csv", row.names = FALSE, quote = FALSE)
data(sat.act, package = "psych")
sa <- na.omit(sat.act[, c("education", "ACT", "SATV", "SATQ")])
write.csv(sa, "sat-act.csv", row.names = FALSE, quote = FALSE)
out <- rbind(expected_statsby(wb, "Group", "within-between"), expected_statsby(sa, "education", "sat-act"))
out$value <- sprintf("%.12g", out$value)
write.csv(out, "expected-statsby.csv", row.names = FALSE, quote = FALSE)

data(attitude)
write.csv(attitude, "attitude.csv", row.names = FALSE, quote = FALSE)
al <- psych::alpha(attitude, check.keys = FALSE, warnings = FALSE)
out <- data.frame(quantity = c("raw_alpha", "std.alpha"), value = sprintf("%.12g", c(al$total$raw_alpha, al$total$std.alpha)))
write.csv(out, "expected-alpha.csv", row.names = FALSE, quote = FALSE)
writeLines(c(paste("R", R.version$major, R.version$minor), paste("psych", packageVersion("psych"))), "versions.txt")

# 3. psych::ICC on Shrout & Fleiss (1979) Table 2, read from the shared reference folder
#    (../shared/reference/shrout_fleiss_1979.csv beside the repository; not copied here):
#    writes expected-icc.csv (ICC, F, df1, df2, p, lower and upper 95% bounds of all six forms).
# LEXICHRON_SHARED_REFERENCE (an absolute path) names the folder when the repository is elsewhere.
shared <- Sys.getenv("LEXICHRON_SHARED_REFERENCE", file.path("..", "..", "..", "..", "shared", "reference"))
sf <- read.csv(file.path(shared, "shrout_fleiss_1979.csv"))
icc <- psych::ICC(sf[, -1])$results
out <- data.frame(type = icc$type, ICC = icc$ICC, F = icc$F, df1 = icc$df1, df2 = icc$df2, p = icc$p,
                  lower = icc[["lower bound"]], upper = icc[["upper bound"]])
for (col in names(out)[-1]) out[[col]] <- sprintf("%.12g", out[[col]])
write.csv(out, "expected-icc.csv", row.names = FALSE, quote = FALSE)
