# Expected values for test/reference/psych.test.ts.
# Run from this folder:  Rscript make-expected.R
# Needs Debian r-base-core and r-cran-psych.
#
# 1. psych::statsBy on psych's own example data `withinBetween` (Revelle; 16 observations in
#    each of 4 groups, built so that within- and between-group correlations differ):
#    writes within-between.csv (data) and expected-statsby.csv (rwg, rbg, ICC1, ICC2).
# 2. psych::alpha on R's `attitude` data (Chatterjee & Price 1977; 30 departments x 7 items):
#    writes attitude.csv (data) and expected-alpha.csv (raw_alpha, std.alpha).
suppressPackageStartupMessages(library(psych))

data(withinBetween, package = "psych")
wb <- withinBetween
write.csv(wb, "within-between.csv", row.names = FALSE, quote = FALSE)
sb <- statsBy(wb, group = "Group", cors = TRUE)
vars <- setdiff(colnames(wb), "Group")
rows <- list()
for (i in seq_along(vars)) for (j in seq_along(vars)) if (i < j) {
  a <- vars[i]; b <- vars[j]
  rows[[length(rows) + 1]] <- data.frame(quantity = "rwg", x = a, y = b, value = sb$rwg[a, b])
  rows[[length(rows) + 1]] <- data.frame(quantity = "rbg", x = a, y = b, value = sb$rbg[a, b])
}
for (a in vars) {
  rows[[length(rows) + 1]] <- data.frame(quantity = "ICC1", x = a, y = "", value = sb$ICC1[[a]])
  rows[[length(rows) + 1]] <- data.frame(quantity = "ICC2", x = a, y = "", value = sb$ICC2[[a]])
}
out <- do.call(rbind, rows)
out$value <- sprintf("%.12g", out$value)
write.csv(out, "expected-statsby.csv", row.names = FALSE, quote = FALSE)

data(attitude)
write.csv(attitude, "attitude.csv", row.names = FALSE, quote = FALSE)
al <- psych::alpha(attitude, check.keys = FALSE, warnings = FALSE)
out <- data.frame(quantity = c("raw_alpha", "std.alpha"), value = sprintf("%.12g", c(al$total$raw_alpha, al$total$std.alpha)))
write.csv(out, "expected-alpha.csv", row.names = FALSE, quote = FALSE)
writeLines(c(paste("R", R.version$major, R.version$minor), paste("psych", packageVersion("psych"))), "versions.txt")
