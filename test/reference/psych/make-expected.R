# Expected values for test/reference/psych.test.ts.
# Run from this folder:  Rscript make-expected.R
# Needs Debian r-base-core and r-cran-psych.
#
# 1. psych::statsBy on two of psych's example data sets:
#    `withinBetween` (16 rows, 4 groups of 4, built so that within- and between-group
#    correlations differ, even in sign) and `sat.act` (self-reported ACT, SAT verbal and SAT
#    quantitative of 700 people, grouped by education; complete rows only).
#    Writes within-between.csv, sat-act.csv (data) and expected-statsby.csv (rwg, rbg, ICC1, ICC2).
# 2. psych::alpha on R's `attitude` data (Chatterjee & Price 1977; 30 departments x 7 items):
#    writes attitude.csv (data) and expected-alpha.csv (raw_alpha, std.alpha).
suppressPackageStartupMessages(library(psych))

expected_statsby <- function(data, group, name) {
  sb <- statsBy(data, group = group, cors = TRUE)
  vars <- setdiff(colnames(data), group)
  rows <- list()
  for (i in seq_along(vars)) for (j in seq_along(vars)) if (i < j) {
    a <- vars[i]; b <- vars[j]
    rows[[length(rows) + 1]] <- data.frame(dataset = name, quantity = "rwg", x = a, y = b, value = sb$rwg[paste0(a, ".wg"), paste0(b, ".wg")])
    rows[[length(rows) + 1]] <- data.frame(dataset = name, quantity = "rbg", x = a, y = b, value = sb$rbg[paste0(a, ".bg"), paste0(b, ".bg")])
  }
  for (a in vars) {
    rows[[length(rows) + 1]] <- data.frame(dataset = name, quantity = "ICC1", x = a, y = "", value = sb$ICC1[[a]])
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
sf <- read.csv(file.path("..", "..", "..", "..", "shared", "reference", "shrout_fleiss_1979.csv"))
icc <- psych::ICC(sf[, -1])$results
out <- data.frame(type = icc$type, ICC = icc$ICC, F = icc$F, df1 = icc$df1, df2 = icc$df2, p = icc$p,
                  lower = icc[["lower bound"]], upper = icc[["upper bound"]])
for (col in names(out)[-1]) out[[col]] <- sprintf("%.12g", out[[col]])
write.csv(out, "expected-icc.csv", row.names = FALSE, quote = FALSE)
