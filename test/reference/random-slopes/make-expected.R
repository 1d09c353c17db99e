# Expected values for test/reference/random-slopes.test.ts.
# Run from this folder:  Rscript make-expected.R
# Needs Debian r-base-core and r-cran-lme4. Fits, with lme4 (Bates et al. 2015, J Stat Softw
# 67(1)), correlated random intercepts and slopes, `y ~ x + (1 + x | g)`, by REML and by ML:
#  1. lme4's sleepstudy (Belenky et al. 2003): Reaction ~ Days + (1 + Days | Subject)
#     (the data are ../sleepstudy/sleepstudy.csv);
#  2. a simulated within/between-centred data set (25 persons x 12 occasions, seed 20261203):
#     rating ~ score_within + score_between + (1 + score_within | person), where score_within is
#     the score minus the person's mean and score_between the person mean minus the mean of the
#     person means; written to centred.csv.
# For each fit: fixed effects, their SEs (vcov), variance components, the intercept-slope
# correlation, sigma^2, the criterion (REMLcrit or deviance) and logLik; plus the random-intercept
# fit of the same fixed effects and the likelihood-ratio statistic between them.
suppressPackageStartupMessages(library(lme4))
ctrl <- lmerControl(optimizer = "bobyqa", optCtrl = list(maxfun = 1e5), check.conv.singular = "ignore")

describe <- function(fit, null, dataset, method) {
  vc <- as.data.frame(VarCorr(fit))
  fe <- fixef(fit)
  se <- sqrt(diag(as.matrix(vcov(fit))))
  crit <- if (method == "REML") REMLcrit(fit) else deviance(fit)
  nullcrit <- if (method == "REML") REMLcrit(null) else deviance(null)
  q <- c(
    setNames(fe, paste0("beta_", names(fe))),
    setNames(se, paste0("se_", names(fe))),
    var_intercept = vc$vcov[vc$grp != "Residual" & vc$var1 == "(Intercept)" & is.na(vc$var2)],
    var_slope = vc$vcov[vc$grp != "Residual" & vc$var1 != "(Intercept)" & is.na(vc$var2)],
    cov_intercept_slope = vc$vcov[!is.na(vc$var2)],
    cor_intercept_slope = vc$sdcor[!is.na(vc$var2)],
    var_residual = sigma(fit)^2,
    criterion = crit,
    loglik = as.numeric(logLik(fit)),
    null_criterion = nullcrit,
    lrt_statistic = nullcrit - crit
  )
  data.frame(dataset = dataset, method = method, quantity = names(q), value = sprintf("%.12g", q))
}

sleep <- read.csv("../sleepstudy/sleepstudy.csv")
sleep$Subject <- factor(sleep$Subject)
out <- list()
for (method in c("REML", "ML")) {
  reml <- method == "REML"
  fit <- lmer(Reaction ~ Days + (1 + Days | Subject), data = sleep, REML = reml, control = ctrl)
  null <- lmer(Reaction ~ Days + (1 | Subject), data = sleep, REML = reml, control = ctrl)
  out[[length(out) + 1]] <- describe(fit, null, "sleepstudy", method)
}

set.seed(20261203)
persons <- 25
occasions <- 12
rows <- list()
for (p in seq_len(persons)) {
  mx <- rnorm(1, 0, 1.5)
  b0 <- rnorm(1, 0, 1)
  b1 <- rnorm(1, 0, 0.35)
  x <- mx + rnorm(occasions)
  y <- 3 + 0.4 * mx + b0 + (0.3 + b1) * (x - mx) + rnorm(occasions, 0, 0.8)
  rows[[p]] <- data.frame(person = sprintf("p%02d", p), score = x, rating = y)
}
d <- do.call(rbind, rows)
pm <- tapply(d$score, d$person, mean)
d$score_within <- d$score - pm[d$person]
d$score_between <- pm[d$person] - mean(pm)
write.csv(transform(d, score = sprintf("%.15g", score), rating = sprintf("%.15g", rating), score_within = sprintf("%.15g", score_within), score_between = sprintf("%.15g", score_between)), "centred.csv", row.names = FALSE, quote = FALSE)
d <- read.csv("centred.csv")
for (method in c("REML", "ML")) {
  reml <- method == "REML"
  fit <- lmer(rating ~ score_within + score_between + (1 + score_within | person), data = d, REML = reml, control = ctrl)
  null <- lmer(rating ~ score_within + score_between + (1 | person), data = d, REML = reml, control = ctrl)
  out[[length(out) + 1]] <- describe(fit, null, "centred", method)
}
write.csv(do.call(rbind, out), "expected.csv", row.names = FALSE, quote = FALSE)
writeLines(c(paste("R", R.version$major, R.version$minor), paste("lme4", packageVersion("lme4"))), "versions.txt")
