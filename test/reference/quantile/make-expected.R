# Expected values for test/stats/quantile.test.ts.
# Run from this folder:  Rscript make-expected.R   (needs Debian r-base-core only)
#
# R stats::quantile, type 7 (Hyndman & Fan 1996, R's default): linear interpolation between the
# order statistics at h = (n - 1) p. Writes expected.csv: data set, p and the quantile.
sets <- list(
  seven = c(3.1, -2, 7.5, 0, 4.25, 10, 1),
  two = c(5, 1),
  ten = 1:10,
  ties = c(2, 2, 2, 9, 9)
)
probs <- c(0, 0.05, 0.2, 0.25, 0.3, 0.5, 0.75, 0.9, 1)
rows <- list()
for (name in names(sets)) {
  q <- quantile(sets[[name]], probs, type = 7, names = FALSE)
  rows[[name]] <- data.frame(set = name, values = paste(sets[[name]], collapse = " "), p = probs, quantile = sprintf("%.12g", q))
}
write.csv(do.call(rbind, rows), "expected.csv", row.names = FALSE, quote = FALSE)
writeLines(paste("R", R.version$major, R.version$minor), "versions.txt")
