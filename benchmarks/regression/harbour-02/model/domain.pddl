; Harbour logistics (a plumbline scenario, invented for this project).
; Trucks carry containers between quays, yards and depots over a road network. Driving a
; road costs its length, set per road in the problem by a static cost function; loading and
; unloading are done by the crane that stands at a site and cost nothing (crane crews are
; paid by the shift). A truck carries at most one container.
(define (domain harbour)
  (:requirements :strips :typing :negative-preconditions :action-costs)
  (:types
    site truck container crane - object
    quay yard depot - site)
  (:predicates
    (road ?from - site ?to - site)
    (truck-at ?t - truck ?s - site)
    (crane-at ?k - crane ?s - site)
    (in ?c - container ?where - (either site truck))
    (laden ?t - truck))
  (:functions
    (road-length ?from - site ?to - site) - number
    (total-cost) - number)

  ; a truck drives one road; the cost is that road's length
  (:action drive
    :parameters (?t - truck ?from - site ?to - site)
    :precondition (and (truck-at ?t ?from) (road ?from ?to))
    :effect (and (not (truck-at ?t ?from))
                 (truck-at ?t ?to)
                 (increase (total-cost) (road-length ?from ?to))))

  ; the site's crane lifts a container from the ground onto an empty truck (free)
  (:action load
    :parameters (?k - crane ?c - container ?t - truck ?s - site)
    :precondition (and (crane-at ?k ?s) (in ?c ?s) (truck-at ?t ?s) (not (laden ?t)))
    :effect (and (not (in ?c ?s)) (in ?c ?t) (laden ?t)))

  ; the site's crane lifts a container off a truck onto the ground (free)
  (:action unload
    :parameters (?k - crane ?c - container ?t - truck ?s - site)
    :precondition (and (crane-at ?k ?s) (in ?c ?t) (truck-at ?t ?s))
    :effect (and (not (in ?c ?t)) (in ?c ?s) (not (laden ?t)))))
