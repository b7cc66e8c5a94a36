#!/bin/bash
# Runs a sharded coldsoak screen on Kubernetes: the plan file into a ConfigMap, the Indexed Job of
# the shards, then, once every shard has completed, the merge Job (deploy/README.md).
# Usage: deploy/kubernetes/run.sh region.yaml [timeout, default 24h]
set -euo pipefail
plan=${1:?usage: run.sh plan.yaml [timeout]}
timeout=${2:-24h}
here=$(dirname "$0")
kubectl create configmap coldsoak-region-plan --from-file=region.yaml="$plan" \
  --dry-run=client -o yaml | kubectl apply -f -
kubectl delete job coldsoak-screen coldsoak-screen-merge --ignore-not-found
kubectl apply -f "$here/screen-job.yaml"
kubectl wait --for=condition=complete job/coldsoak-screen --timeout="$timeout"
kubectl apply -f "$here/merge-job.yaml"
kubectl wait --for=condition=complete job/coldsoak-screen-merge --timeout="$timeout"
kubectl logs job/coldsoak-screen-merge
